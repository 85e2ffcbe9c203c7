import { describe, expect, it } from 'vitest';
import { parseAddressList } from '@/lib/accounts/parse-address-list';

// Address syntax per RFC 5321/5322 as zod checks it; the examples are invented (@demo.evenload.test).
describe('parseAddressList', () => {
  it('reads one address', () => {
    expect(parseAddressList('ines.kolar@demo.evenload.test')).toEqual({ valid: ['ines.kolar@demo.evenload.test'], invalid: [] });
  });

  it('reads a pasted list separated by commas, semicolons, spaces and new lines, lower-cased', () => {
    const raw = 'A@demo.evenload.test, b@demo.evenload.test;c@demo.evenload.test\n d@demo.evenload.test\te@demo.evenload.test';
    expect(parseAddressList(raw).valid).toEqual(['a', 'b', 'c', 'd', 'e'].map((x) => `${x}@demo.evenload.test`));
  });

  it('keeps the address of "Name <address>" entries, even with spaces in the name', () => {
    expect(parseAddressList('Ines Kolar <ines@demo.evenload.test>, "Bo, Li" <bo@demo.evenload.test>').valid).toEqual([
      'ines@demo.evenload.test',
      'bo@demo.evenload.test',
    ]);
  });

  it('counts a repeated address once, whatever its case', () => {
    expect(parseAddressList('x@demo.evenload.test X@DEMO.evenload.test').valid).toEqual(['x@demo.evenload.test']);
  });

  it('lists every entry that is not an address, as typed', () => {
    const parsed = parseAddressList('ok@demo.evenload.test, not-an-address, @demo.evenload.test, two@@demo.evenload.test');
    expect(parsed.valid).toEqual(['ok@demo.evenload.test']);
    expect(parsed.invalid).toEqual(['not-an-address', '@demo.evenload.test', 'two@@demo.evenload.test']);
  });

  it('gives nothing for blank input', () => {
    expect(parseAddressList('  \n ,; ')).toEqual({ valid: [], invalid: [] });
  });
});
