import Papa from 'papaparse';
import { fromInputUnit, type UnitSystem } from '@/lib/calc/units';
import { readNumber } from '@/lib/format/parse-number';
import { AppError } from '@/lib/http/errors';

/**
 * Hold readings as typed or uploaded: a small CSV (comma, semicolon or tab), one row per time,
 *
 *   elapsed,after_pass,1,2,3,4
 *   0,4,81.2,80.9,81.5,80.7
 *   10 min,4,80.1,79.8,80.6,79.9
 *   1 h,,79.5,79.2,80.1,79.4
 *
 * `elapsed`: seconds, or a number with `s`, `min` or `h`; `after_pass` (optional column, or empty
 * cell): the pass the hold follows, the last pass when not given; then one column per position,
 * 1 to the stud count, loads in kN (SI) or lbf (US).
 */

export interface HoldPoint {
  afterPass: number;
  elapsedS: number;
  /** Every stud's load, N (index 0 = position 1). */
  loadsN: number[];
}

/** Holds of a run are small: at most this many time points per upload (ours). */
export const MAX_HOLD_POINTS = 200;
const MAX_ELAPSED_S = 30 * 24 * 3600; // 30 days (ours)

const UNIT_SECONDS: Record<string, number> = { s: 1, sec: 1, min: 60, m: 60, h: 3600, hr: 3600 };

const refuse = (line: number, message: string): never => {
  throw new AppError('invalid_input', `Hold readings, line ${line}: ${message}`, { field: 'holds' });
};

/** "600", "10 min", "1 h", "1,5 h" → seconds; NaN when unreadable. */
export function elapsedSeconds(text: string): number {
  const m = /^\s*([^a-zA-Z]+?)\s*([a-zA-Z]*)\s*$/.exec(text);
  if (!m) return Number.NaN;
  const factor = m[2] === '' ? 1 : UNIT_SECONDS[m[2]!.toLowerCase()];
  const n = readNumber(m[1]!);
  return factor === undefined || n.kind !== 'number' ? Number.NaN : n.value * factor;
}

/**
 * Reads hold readings for a run of `studCount` studs and `passCount` passes.
 * @throws AppError `invalid_input` naming the line for a missing column, an unreadable or negative
 * value, a pass outside the run, the same time twice, or no rows.
 */
export function parseHoldReadings(text: string, options: { studCount: number; passCount: number; units: UnitSystem }): HoldPoint[] {
  const { studCount, passCount, units } = options;
  const rows = Papa.parse<string[]>(text.trim(), { skipEmptyLines: 'greedy' }).data;
  const header = (rows[0] ?? []).map((c) => c.trim().toLowerCase());
  if (!header[0]?.startsWith('elapsed')) refuse(1, 'the first column must be "elapsed" (seconds, or a time with s, min or h).');
  const passColumn = header.findIndex((c) => c === 'after_pass' || c === 'after pass');
  const positionColumns = Array.from({ length: studCount }, (_, i) => {
    const at = header.findIndex((c) => c.replace(/^(stud|position|p)\s*/, '') === String(i + 1));
    return at < 0 ? refuse(1, `there is no column for position ${i + 1}; name the columns 1 to ${studCount}.`) : at;
  });
  if (rows.length < 2) refuse(2, 'there are no readings under the header.');
  if (rows.length - 1 > MAX_HOLD_POINTS) refuse(MAX_HOLD_POINTS + 2, `keep to ${MAX_HOLD_POINTS} times per upload.`);
  const seen = new Set<string>();
  return rows.slice(1).map((row, index) => {
    const line = index + 2;
    const elapsedS = Math.round(elapsedSeconds(row[0] ?? ''));
    if (!Number.isFinite(elapsedS) || elapsedS < 0 || elapsedS > MAX_ELAPSED_S) refuse(line, 'the elapsed time must be 0 or more, in seconds or with s, min or h, up to 30 days.');
    const passText = passColumn < 0 ? '' : (row[passColumn] ?? '').trim();
    const afterPass = passText === '' ? passCount : Number(passText);
    if (!Number.isInteger(afterPass) || afterPass < 1 || afterPass > passCount) refuse(line, `after_pass must be a pass of this run, 1 to ${passCount}.`);
    const key = `${afterPass}/${elapsedS}`;
    if (seen.has(key)) refuse(line, 'this time after this pass is already given on an earlier line.');
    seen.add(key);
    const loadsN = positionColumns.map((column, i) => {
      const n = readNumber(row[column] ?? '');
      if (n.kind !== 'number' || !(n.value >= 0)) return refuse(line, `position ${i + 1} needs a load of 0 or more.`);
      return fromInputUnit('force', n.value, units);
    });
    return { afterPass, elapsedS, loadsN };
  });
}
