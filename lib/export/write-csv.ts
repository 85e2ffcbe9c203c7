/**
 * The one CSV writer: every export (one run, a selection, the pseudonymised research export)
 * writes its rows here, with papaparse's `unparse` doing the quoting (RFC 4180: a cell with a
 * comma, a double quote, CR, LF or an edge space is quoted, inner quotes doubled) and CRLF line
 * endings. Pure and browser-safe.
 *
 * Formula escape rule (after OWASP's "CSV Injection" page,
 * https://owasp.org/www-community/attacks/CSV_Injection): a spreadsheet runs a cell that starts
 * with `=`, `+`, `-`, `@`, tab or CR as a formula, so such a text cell gets a leading `'` and is
 * quoted. A cell is escaped **only when it is not a plain finite number**: numbers (`-12.5`) and
 * text that is a plain number (`"-12.5"`, `"+4"`, `"-1e-3"`) stay as they are, since a number runs
 * nothing and quoting it would break spreadsheet arithmetic and the re-import of our own exports.
 * Missing and non-finite numbers are written as empty cells.
 */
import Papa from 'papaparse';

/** What a cell may hold. */
export type CsvValue = string | number | null | undefined;

/** Starts with `=`, `+`, `-`, `@`, tab or CR and is not a plain number (the rule above). */
export const FORMULA_CELL = /^(?![+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$)[=+\-@\t\r]/;

/** One value as the text papaparse receives (numbers as `String(n)`, missing as empty). */
function cellText(value: CsvValue): string | number {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? value : '';
  return value;
}

/**
 * Rows as CSV text, each row ending in CRLF (no rows give `""`), so chunks of a streamed export
 * can be concatenated.
 *
 * @example csvRows([['run_id', 'load_N'], [7, -12.5], ['=A\nB', '-12.5']])
 * // 'run_id,load_N\r\n7,-12.5\r\n"\'=A\nB",-12.5\r\n'
 */
export function csvRows(rows: readonly (readonly CsvValue[])[]): string {
  if (rows.length === 0) return '';
  const text = Papa.unparse(
    rows.map((row) => row.map(cellText)),
    { quotes: false, newline: '\r\n', header: false, escapeFormulae: FORMULA_CELL, skipEmptyLines: false },
  );
  return `${text}\r\n`;
}

