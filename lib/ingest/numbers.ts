/**
 * Strict number parsing for logger cells. A cell is a number only when it is a plain decimal
 * (optionally signed, optionally with an exponent); units, thousands separators, `NaN` and
 * `Infinity` are rejected with a reason so the user can fix the file.
 */

const DECIMAL_POINT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA = /^[+-]?(?:\d+(?:,\d*)?|,\d+)(?:[eE][+-]?\d+)?$/;
const LOOKS_DECIMAL_COMMA = /^[+-]?\d+,\d+$/;
const NON_FINITE = /^[+-]?(?:nan|inf|infinity|#num!|#div\/0!|#value!|#n\/a)$/i;

/** The outcome of reading one cell: a number, an empty cell, or the reason it is not a number. */
export type CellNumber =
  | { kind: 'number'; value: number }
  | { kind: 'empty' }
  | { kind: 'invalid'; reason: string };

/**
 * Reads a cell as a number. With `decimalComma` the only decimal separator accepted is `,`;
 * without it only `.`. The reason names the problem in words (`is not a number`,
 * `is not a finite number`, `uses a decimal point but this file uses decimal commas`, ...).
 */
export function readNumberCell(raw: string, decimalComma: boolean): CellNumber {
  const cell = raw.trim();
  if (cell === '') return { kind: 'empty' };
  if (NON_FINITE.test(cell)) return { kind: 'invalid', reason: 'is not a finite number' };
  if (decimalComma) {
    if (DECIMAL_COMMA.test(cell)) return { kind: 'number', value: Number(cell.replace(',', '.')) };
    if (DECIMAL_POINT.test(cell) && cell.includes('.')) {
      return { kind: 'invalid', reason: 'uses a decimal point but this file uses decimal commas' };
    }
    return { kind: 'invalid', reason: 'is not a number' };
  }
  if (DECIMAL_POINT.test(cell)) {
    const value = Number(cell);
    if (!Number.isFinite(value)) return { kind: 'invalid', reason: 'is not a finite number' };
    return { kind: 'number', value };
  }
  if (LOOKS_DECIMAL_COMMA.test(cell)) {
    return { kind: 'invalid', reason: 'looks like a decimal comma but this file uses decimal points' };
  }
  return { kind: 'invalid', reason: 'is not a number' };
}

/** True when `cell` would be read as a number with either decimal separator. */
export function isNumericText(cell: string): boolean {
  const c = cell.trim();
  return c !== '' && (DECIMAL_POINT.test(c) || DECIMAL_COMMA.test(c));
}
