import { describe, expect, it } from 'vitest';
import { parseNumberText, readNumber } from '@/lib/format/parse-number';

// Expected values: the decimal-comma rule written in lib/format/parse-number.ts (issue 14, problem 7)
// and the separators of the Unicode CLDR number symbols (en: "1,234.5"; de: "1.234,5"; fr: "1 234,5"
// with a narrow no-break space), https://cldr.unicode.org/translation/number-currency-formats.
describe('readNumber (typed numbers)', () => {
  it.each([
    ['1,500', 1500], // comma + exactly three digits: thousands (issue 14 rule)
    ['1,500.5', 1500.5], // CLDR en
    ['1.500,5', 1500.5], // CLDR de
    ['1,5', 1.5], // comma + one digit: decimal comma
    ['12,25', 12.25], // comma + two digits
    ['1,2500', 1.25], // comma + four digits
    ['1.500', 1.5], // a single point is a decimal point
    ['12 500', 12500], // space as thousands separator
    ['1\u202f234,5', 1234.5], // CLDR fr: narrow no-break space
    ['1\u2009234\u00a0567.25', 1234567.25], // thin and no-break spaces
    ['1,234,567', 1234567],
    ['1.234.567', 1234567],
    ['-12.5', -12.5],
    ['\u22123,5', -3.5], // the minus sign U+2212
    ['+4', 4],
    ['1.5e3', 1500],
    ['.5', 0.5],
    [' 81.3 ', 81.3],
  ])('%j is %d', (text, expected) => {
    expect(readNumber(text)).toEqual({ kind: 'number', value: expected });
  });

  it.each([
    ['0,500', /unclear: write 0\.500/], // 0.5 or 500? refused, never guessed
    ['1234,567', /unclear/],
    ['1,50.5', /thousands separators in the wrong places/],
    ['1 5', /thousands separators in the wrong places/],
    ['1,5,3', /thousands separators in the wrong places/],
    ['1.5.0,2', /thousands separators in the wrong places/],
    ['1,5.3,2', /cannot be read/],
    ['12abc', /is not a number/],
    ['--3', /is not a number/],
    ['.', /is not a number/],
    ['1e999', /is not a finite number/],
  ])('%j is refused with a reason', (text, reason) => {
    const reading = readNumber(text);
    expect(reading.kind).toBe('invalid');
    expect(reading.kind === 'invalid' ? reading.reason : '').toMatch(reason);
  });

  it('empty text is empty, and parseNumberText gives NaN for it and for refused text', () => {
    expect(readNumber('  ')).toEqual({ kind: 'empty' });
    expect(parseNumberText('')).toBeNaN();
    expect(parseNumberText('0,500')).toBeNaN();
    expect(parseNumberText('1,500')).toBe(1500);
  });
});

describe('readNumber (one convention per logger file)', () => {
  it('reads a comma as the decimal separator in a decimal-comma file and refuses grouping', () => {
    expect(readNumber('1,500', 'comma')).toEqual({ kind: 'number', value: 1.5 });
    expect(readNumber('1,500', 'point').kind).toBe('invalid');
    expect(readNumber('1.500,5', 'comma').kind).toBe('invalid');
    expect(readNumber('1 500', 'point').kind).toBe('invalid');
    expect(readNumber('-1.5e-3', 'point')).toEqual({ kind: 'number', value: -0.0015 });
  });
});
