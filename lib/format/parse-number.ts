/**
 * The one number parser: every number a person types (hand-entry grid, calculator, joint, method
 * and lubricant forms) and every logger cell goes through `readNumber`.
 *
 * Typed numbers (rule `typed`, the default) accept either decimal convention, by this rule:
 * - A sign (`+`, `-` or the minus sign U+2212) may lead; an exponent (`1.5e3`) may follow a plain
 *   number without thousands separators.
 * - Spaces (ordinary, no-break U+00A0, thin U+2009, narrow no-break U+202F) are thousands
 *   separators: `"12 500"` = 12500. With spaces, a `,` or `.` after the last group is the decimal
 *   separator: `"12 500,5"` = 12500.5.
 * - When both `,` and `.` appear, the last one is the decimal separator and the other the thousands
 *   separator: `"1,500.5"` = 1500.5, `"1.500,5"` = 1500.5.
 * - A single `,` followed by exactly three digits is a thousands separator (`"1,500"` = 1500);
 *   followed by 1–2 or 4 and more digits it is a decimal comma (`"1,5"` = 1.5, `"12,25"` = 12.25,
 *   `"1,2500"` = 1.25). A single `.` is always a decimal point (`"1.500"` = 1.5).
 * - Two or more of the same separator are thousands separators (`"1,234,567"`, `"1.234.567"`).
 * - Thousands groups must be whole: one to three digits first (not a lone 0), three digits after
 *   each separator. Anything else is refused with a sentence saying why, never guessed:
 *   `"0,500"` (0.5 or 500?), `"1,50.5"`, `"1 5"`, `"1,5,3"`, `"12abc"`.
 *
 * Logger files (rule `point` or `comma`: no thousands separators) use one convention for a whole file,
 * detected once from the data (lib/ingest/detect.ts) and passed in, so a logger's `"1,500"` in a
 * decimal-comma file is 1.5 and thousands separators are refused.
 *
 * The rule is our own (common practice: the CLDR locale data lists `,` and `.` as either decimal or
 * grouping separator and spaces as grouping separators in many locales; a comma followed by exactly
 * three digits is read as grouping, as en-US readers do).
 */

/**
 * How a text is read: `typed` (either decimal separator, thousands separators allowed, by the rule
 * above) or one logger file's convention, `point` or `comma` (that decimal separator only, no grouping).
 */
export type NumberRule = 'typed' | 'point' | 'comma';

/** The outcome of reading a text: a number, an empty text, or the reason it is not a number. */
export type NumberReading = { kind: 'number'; value: number } | { kind: 'empty' } | { kind: 'invalid'; reason: string };

const SPACES = /[ \u00a0\u2009\u202f]/;
const SPACES_ALL = new RegExp(SPACES.source, 'g');
const SIGN = /^[+\-\u2212]/;
const EXPONENT = /[eE][+-]?\d+$/;
const GROUPED = /^[1-9]\d{0,2}(?:S\d{3})+$/;
const NOT_A_NUMBER = 'is not a number';

const invalid = (reason: string): NumberReading => ({ kind: 'invalid', reason });

/** `whole` + optional `fraction` (digits only) → a number, or the reason it is not one. */
function assemble(sign: string, whole: string, fraction: string | null, exponent: string): NumberReading {
  if (whole === '' && (fraction === null || fraction === '')) return invalid(NOT_A_NUMBER);
  if (!/^\d*$/.test(whole) || (fraction !== null && !/^\d*$/.test(fraction))) return invalid(NOT_A_NUMBER);
  const value = Number(`${sign === '-' ? '-' : ''}${whole || '0'}${fraction ? `.${fraction}` : ''}${exponent}`);
  return Number.isFinite(value) ? { kind: 'number', value } : invalid('is not a finite number');
}

/** Whole part with thousands separator `sep` checked for whole groups; digits back, or null. */
function ungroup(whole: string, sep: string): string | null {
  if (!whole.includes(sep)) return /^\d+$/.test(whole) ? whole : null;
  const pattern = new RegExp(GROUPED.source.replace('S', sep === '.' ? '\\.' : sep));
  return pattern.test(whole) ? whole.split(sep).join('') : null;
}

function readGrouped(sign: string, body: string): NumberReading {
  const badGroups = invalid('has thousands separators in the wrong places (groups of three digits: 1,500 or 1 500)');
  if (SPACES.test(body)) {
    const parts = body.replace(SPACES_ALL, ' ').match(/^([\d ]+)(?:[.,](\d*))?$/);
    if (!parts) return invalid(NOT_A_NUMBER);
    const digits = ungroup(parts[1]!, ' ');
    return digits === null ? badGroups : assemble(sign, digits, parts[2] ?? null, '');
  }
  const commas = body.split(',').length - 1;
  const points = body.split('.').length - 1;
  if (commas > 0 && points > 0) {
    const decimalSep = body.lastIndexOf(',') > body.lastIndexOf('.') ? ',' : '.';
    const at = body.lastIndexOf(decimalSep);
    if (body.indexOf(decimalSep) !== at) return invalid('uses both , and . in a way that cannot be read (write 1500.5 or 1,500.5)');
    const digits = ungroup(body.slice(0, at), decimalSep === ',' ? '.' : ',');
    return digits === null ? badGroups : assemble(sign, digits, body.slice(at + 1), '');
  }
  const sep = commas > 0 ? ',' : points > 0 ? '.' : null;
  const exponent = body.match(EXPONENT)?.[0] ?? '';
  const plain = body.slice(0, body.length - exponent.length);
  if (sep === null) return assemble(sign, plain, null, exponent);
  if (commas + points === 1) {
    const [whole = '', fraction = ''] = plain.split(sep);
    if (sep === '.' || fraction.length !== 3) return assemble(sign, whole, fraction, exponent);
    if (exponent) return invalid(NOT_A_NUMBER);
    if (!/^[1-9]\d{0,2}$/.test(whole)) return invalid(`is unclear: write ${whole || '0'}.${fraction} for a decimal, or leave out the comma for a whole number`);
    return assemble(sign, `${whole}${fraction}`, null, '');
  }
  if (exponent) return invalid(NOT_A_NUMBER);
  const digits = ungroup(plain, sep);
  return digits === null ? badGroups : assemble(sign, digits, null, '');
}

const FIXED = {
  point: /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/,
  comma: /^[+-]?(?:\d+(?:,\d*)?|,\d+)(?:[eE][+-]?\d+)?$/,
};

/** One decimal separator, no grouping (logger cells: a plain regular expression, as this runs per cell). */
function readFixed(text: string, decimal: 'point' | 'comma'): NumberReading {
  if (!FIXED[decimal].test(text)) return invalid(NOT_A_NUMBER);
  const value = Number(decimal === 'comma' ? text.replace(',', '.') : text);
  return Number.isFinite(value) ? { kind: 'number', value } : invalid('is not a finite number');
}

/**
 * Reads a text as a number by `rule` (typed numbers by default; see the file comment).
 *
 * @example readNumber('1,500') // { kind: 'number', value: 1500 }
 * @example readNumber('1,5') // { kind: 'number', value: 1.5 }
 * @example readNumber('1.500,5') // { kind: 'number', value: 1500.5 }
 * @example readNumber('1,5', 'point') // { kind: 'invalid', reason: 'is not a number' }
 */
export function readNumber(text: string, rule: NumberRule = 'typed'): NumberReading {
  const trimmed = text.trim();
  if (trimmed === '') return { kind: 'empty' };
  if (rule !== 'typed') return readFixed(trimmed, rule);
  const sign = SIGN.test(trimmed) ? (trimmed[0] === '+' ? '+' : '-') : '';
  const body = sign ? trimmed.slice(1) : trimmed;
  if (body === '' || SIGN.test(body)) return invalid(NOT_A_NUMBER);
  return readGrouped(sign, body);
}

/** A typed number, or NaN for empty or unreadable text (for inputs that flag NaN themselves). */
export function parseNumberText(text: string | null | undefined): number {
  const reading = readNumber(text ?? '');
  return reading.kind === 'number' ? reading.value : Number.NaN;
}
