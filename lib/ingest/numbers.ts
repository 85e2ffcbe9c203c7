/**
 * Number parsing for logger cells, through the one parser (lib/format/parse-number.ts) with the
 * file's decimal separator (detected once per file, lib/ingest/detect.ts) and no thousands
 * separators: a cell is a number only when it is a plain decimal (optionally signed, optionally
 * with an exponent); units, thousands separators, `NaN` and `Infinity` are rejected with a reason
 * so the user can fix the file.
 */
import { readNumber, type NumberReading } from '@/lib/format/parse-number';

const LOOKS_DECIMAL_COMMA = /^[+-]?\d+,\d+$/;
const NON_FINITE = /^[+-]?(?:nan|inf|infinity|#num!|#div\/0!|#value!|#n\/a)$/i;

/** The outcome of reading one cell: a number, an empty cell, or the reason it is not a number. */
export type CellNumber = NumberReading;

/**
 * Reads a cell as a number. With `decimalComma` the only decimal separator accepted is `,`;
 * without it only `.`. The reason names the problem in words (`is not a number`,
 * `is not a finite number`, `uses a decimal point but this file uses decimal commas`, ...).
 */
export function readNumberCell(raw: string, decimalComma: boolean): CellNumber {
  const cell = raw.trim();
  if (NON_FINITE.test(cell)) return { kind: 'invalid', reason: 'is not a finite number' };
  const reading = readNumber(cell, decimalComma ? 'comma' : 'point');
  if (reading.kind !== 'invalid' || reading.reason !== 'is not a number') return reading;
  if (decimalComma && cell.includes('.') && readNumber(cell, 'point').kind === 'number') {
    return { kind: 'invalid', reason: 'uses a decimal point but this file uses decimal commas' };
  }
  if (!decimalComma && LOOKS_DECIMAL_COMMA.test(cell)) {
    return { kind: 'invalid', reason: 'looks like a decimal comma but this file uses decimal points' };
  }
  return reading;
}

/** True when `cell` would be read as a number with either decimal separator. */
export function isNumericText(cell: string): boolean {
  return (['point', 'comma'] as const).some((rule) => {
    const reading = readNumber(cell, rule);
    return reading.kind === 'number' || (reading.kind === 'invalid' && reading.reason === 'is not a finite number');
  });
}

/**
 * The decimal separator a data cell shows, for the file-level vote in lib/ingest/detect.ts: `comma`
 * for a number read only with a decimal comma (`"12,5"`), `point` for one with a decimal point
 * (`"12.5"`), null for whole numbers and text.
 */
export function decimalSeparatorOf(cell: string): 'comma' | 'point' | null {
  const c = cell.trim();
  if (c.includes(',')) return readNumber(c, 'comma').kind === 'number' ? 'comma' : null;
  if (c.includes('.')) return readNumber(c, 'point').kind === 'number' ? 'point' : null;
  return null;
}

/** A cell's value read with either decimal separator (point first), for guesses such as the load unit; null when it is not a number. */
export function valueInEitherConvention(cell: string): number | null {
  for (const rule of ['point', 'comma'] as const) {
    const reading = readNumber(cell, rule);
    if (reading.kind === 'number') return reading.value;
  }
  return null;
}
