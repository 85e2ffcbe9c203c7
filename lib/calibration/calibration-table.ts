import { AppError } from '@/lib/http/errors';
import { readNumber } from '@/lib/format/parse-number';

/**
 * The calibration table: every position's gauge read against the reference load cell at 4–6 load
 * levels, loading then unloading, ending with the load removed (zero return). One layout serves
 * the hand-entry grid and an uploaded file (our own simple format, documented on the page):
 *
 *   direction,load_cell_kN,p1,p2,…,pN
 *   up,0,0,0,…          (optional starting zero)
 *   up,40,39.6,40.3,…   (4–6 levels above zero)
 *   down,40,40.1,40.6,…  (the same levels on the way down)
 *   down,0,0.1,0.0,…    (required: the zero return)
 *
 * Gauge cells are the load each gauge indicates in kN with a calibration factor of 1. Delimiter:
 * comma, semicolon or tab (from the header line); numbers are read by `readNumber` (a decimal
 * comma is fine with a semicolon or tab delimiter).
 */
export type Direction = 'up' | 'down';

export interface CalibrationRow {
  direction: Direction;
  loadCellKn: number;
  /** Indicated load per position (index 0 = position 1), kN. */
  gaugeKn: number[];
}

export const CALIBRATION_LEVELS = { min: 4, max: 6 } as const;
/** How far an unloading row may sit from its loading level, as % of full scale (ours). */
export const LEVEL_MATCH_PERCENT = 5;

export const calibrationHeader = (studCount: number): string[] => ['direction', 'load_cell_kN', ...Array.from({ length: studCount }, (_, i) => `p${i + 1}`)];

function delimiterOf(line: string): string {
  if (line.includes('\t')) return '\t';
  if (line.includes(';')) return ';';
  return ',';
}

function cellNumber(text: string, line: number, column: string): number {
  const reading = readNumber(text.trim());
  if (reading.kind === 'number') return reading.value;
  const why = reading.kind === 'empty' ? 'is empty' : `is not a number (${reading.reason})`;
  throw new AppError('invalid_input', `Line ${line}, column ${column} ${why}.`, { field: 'table' });
}

/**
 * Reads the calibration table text for a joint with `studCount` positions.
 * @throws AppError invalid_input naming the line and column.
 */
export function readCalibrationTable(text: string, studCount: number): CalibrationRow[] {
  const lines = text.split(/\r?\n/).map((l, i) => ({ text: l.trim(), line: i + 1 })).filter((l) => l.text !== '');
  const first = lines.shift();
  if (!first) throw new AppError('invalid_input', 'The calibration table is empty.', { field: 'table' });
  const delimiter = delimiterOf(first.text);
  const header = first.text.split(delimiter).map((c) => c.trim().toLowerCase());
  const expected = calibrationHeader(studCount).map((c) => c.toLowerCase());
  if (header.length !== expected.length || header.some((c, i) => c !== expected[i])) {
    throw new AppError('invalid_input', `The first line must be: ${calibrationHeader(studCount).join(delimiter === '\t' ? ' ' : delimiter)}`, { field: 'table' });
  }
  if (lines.length > 40) throw new AppError('invalid_input', 'A calibration table has at most 40 rows.', { field: 'table' });
  return lines.map(({ text: row, line }) => {
    const cells = row.split(delimiter);
    if (cells.length !== expected.length) throw new AppError('invalid_input', `Line ${line} has ${cells.length} cells; expected ${expected.length}.`, { field: 'table' });
    const direction = cells[0]!.trim().toLowerCase();
    if (direction !== 'up' && direction !== 'down') throw new AppError('invalid_input', `Line ${line}: direction must be "up" or "down".`, { field: 'table' });
    const loadCellKn = cellNumber(cells[1]!, line, 'load_cell_kN');
    if (loadCellKn < 0) throw new AppError('invalid_input', `Line ${line}: the load cell reading cannot be negative.`, { field: 'table' });
    return { direction, loadCellKn, gaugeKn: cells.slice(2).map((c, i) => cellNumber(c, line, `p${i + 1}`)) };
  });
}

export interface CalibrationLevels {
  fullScaleKn: number;
  /** Points above zero, both directions, for the fit and linearity. */
  loaded: CalibrationRow[];
  /** Each loading level with its unloading row. */
  pairs: { up: CalibrationRow; down: CalibrationRow }[];
  /** The last unloading row at zero load. */
  zero: CalibrationRow;
}

/**
 * Checks the table's shape: 4–6 loading levels above zero, one unloading row per level (matched to
 * the nearest loading level within {@link LEVEL_MATCH_PERCENT} % of full scale), and a final
 * unloading row at zero.
 * @throws AppError invalid_input saying what is missing.
 */
export function calibrationLevels(rows: readonly CalibrationRow[]): CalibrationLevels {
  const ups = rows.filter((r) => r.direction === 'up' && r.loadCellKn > 0);
  const downs = rows.filter((r) => r.direction === 'down' && r.loadCellKn > 0);
  if (ups.length < CALIBRATION_LEVELS.min || ups.length > CALIBRATION_LEVELS.max) {
    throw new AppError('invalid_input', `Load the gauges at ${CALIBRATION_LEVELS.min} to ${CALIBRATION_LEVELS.max} levels above zero (the table has ${ups.length}).`, { field: 'table' });
  }
  if (downs.length !== ups.length) {
    throw new AppError('invalid_input', `Read every level again while unloading: ${ups.length} loading levels but ${downs.length} unloading rows above zero.`, { field: 'table' });
  }
  const last = rows[rows.length - 1];
  if (!last || last.direction !== 'down' || last.loadCellKn !== 0) {
    throw new AppError('invalid_input', 'End the table with an unloading row at 0 kN (the zero return).', { field: 'table' });
  }
  const fullScaleKn = Math.max(...ups.map((r) => r.loadCellKn), ...downs.map((r) => r.loadCellKn));
  const unused = new Set(downs);
  const pairs = ups.map((up) => {
    let best: CalibrationRow | null = null;
    for (const down of unused) if (!best || Math.abs(down.loadCellKn - up.loadCellKn) < Math.abs(best.loadCellKn - up.loadCellKn)) best = down;
    if (!best || (Math.abs(best.loadCellKn - up.loadCellKn) / fullScaleKn) * 100 > LEVEL_MATCH_PERCENT) {
      throw new AppError('invalid_input', `The loading level at ${up.loadCellKn} kN has no unloading row near it (within ${LEVEL_MATCH_PERCENT} % of full scale).`, { field: 'table' });
    }
    unused.delete(best);
    return { up, down: best };
  });
  return { fullScaleKn, loaded: [...ups, ...downs], pairs, zero: last };
}
