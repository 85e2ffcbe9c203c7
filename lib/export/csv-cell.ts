/**
 * One CSV cell (RFC 4180 quoting), with spreadsheet formula injection neutralised: a text cell
 * that starts with = + - @ (or a tab / carriage return) gets a leading apostrophe, so a
 * spreadsheet shows it as text instead of running it (OWASP "CSV Injection"). Numbers are written
 * as numbers: a negative load stays -12.5, not '-12.5.
 */
export function neutraliseCsvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const safe = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\n\r]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function csvLine(cells: readonly (string | number | null | undefined)[]): string {
  return `${cells.map(neutraliseCsvCell).join(',')}\r\n`;
}
