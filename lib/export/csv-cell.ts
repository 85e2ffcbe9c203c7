import { neutraliseCsvCell as neutraliseText } from '../ingest/export-csv';

/**
 * One CSV cell of any value: text goes through the one formula-injection and quoting rule of
 * lib/ingest/export-csv.ts (OWASP "CSV Injection", RFC 4180); numbers are written as numbers (a
 * negative load stays -12.5); missing and non-finite values are empty.
 */
export function neutraliseCsvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  return neutraliseText(value);
}

export function csvLine(cells: readonly (string | number | null | undefined)[]): string {
  return `${cells.map(neutraliseCsvCell).join(',')}\r\n`;
}
