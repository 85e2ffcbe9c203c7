import { describe, expect, it } from 'vitest';
import { csvLine, neutraliseCsvCell } from '@/lib/export/csv-cell';

// Quoting per RFC 4180 §2; formula neutralising per the OWASP "CSV Injection" guidance.
describe('neutraliseCsvCell', () => {
  it.each([
    ['=SUM(A1:A9)', "'=SUM(A1:A9)"],
    ['+1+2', "'+1+2"],
    ['-2+3', "'-2+3"],
    ['@cmd', "'@cmd"],
    ['\tx', "'\tx"],
  ])('puts an apostrophe before a text cell starting with a formula character: %j', (raw, expected) => {
    expect(neutraliseCsvCell(raw)).toBe(expected);
  });

  it('quotes cells with commas, quotes or line breaks and doubles inner quotes', () => {
    expect(neutraliseCsvCell('Three cross passes 30/60/100 %, circular check')).toBe('"Three cross passes 30/60/100 %, circular check"');
    expect(neutraliseCsvCell('say "even"')).toBe('"say ""even"""');
    expect(neutraliseCsvCell('=a,b')).toBe(`"'=a,b"`);
  });

  it('writes numbers as numbers, negative ones included, and empties for missing values', () => {
    expect(neutraliseCsvCell(-12.5)).toBe('-12.5');
    expect(neutraliseCsvCell(Number.NaN)).toBe('');
    expect(neutraliseCsvCell(null)).toBe('');
    expect(csvLine([1, 'a', null])).toBe('1,a,\r\n');
  });
});
