/**
 * Reading single cells of a logger table's data rows, with messages that name the line and the
 * column. Shared by the shape readers (`wide.ts`, `long.ts`, `step-table.ts`).
 */
import { AppError } from '@/lib/http/errors';
import type { JointForImport } from './types';
import { readNumberCell } from '../numbers';
import { quoteInput } from '../text-limits';
import { loadToN, type LoadUnit, type StrainConversion } from '../units';
import { formatInputValue } from '@/lib/calc/units';

/** An `invalid_input` error naming the file line and the column. */
export function cellError(line: number, column: string, message: string): AppError {
  const name = quoteInput(column);
  return new AppError('invalid_input', `Line ${line}, column ${name}: ${message}`, { row: line, column: name.slice(1, -1) });
}

/** A load in N for messages: kN from 1000 N up, six significant figures. */
export function formatLoadN(n: number): string {
  return Math.abs(n) >= 1000 ? `${formatInputValue(n / 1000, 6)} kN` : `${formatInputValue(n, 6)} N`;
}

/** Stud positions for messages, e.g. `2, 5`. */
export function listPositions(positions: readonly number[]): string {
  return positions.join(', ');
}

/** Positions (1-based) whose entry passes `isMissing`, for "no reading for position …" messages. */
export function missingPositions<T>(values: ArrayLike<T>, isMissing: (value: T) => boolean): number[] {
  const missing: number[] = [];
  for (let k = 0; k < values.length; k++) if (isMissing(values[k]!)) missing.push(k + 1);
  return missing;
}

/**
 * Whether a cell is a plain decimal with a decimal point: an optional `-`, digits, and optionally a
 * point and digits (`12`, `-0.077`, `1500.25`). Such a cell reads the same through `Number` as through
 * {@link readNumberCell}; anything else (spaces, signs, exponents, commas, text) goes to the full
 * parser. Checked character by character, as this runs for every load cell of a file.
 */
export function isPlainDecimal(cell: string): boolean {
  const n = cell.length;
  let i = n > 0 && cell.charCodeAt(0) === 45 ? 1 : 0;
  const digitsFrom = i;
  while (i < n && cell.charCodeAt(i) >= 48 && cell.charCodeAt(i) <= 57) i++;
  if (i === digitsFrom) return false;
  if (i === n) return true;
  if (cell.charCodeAt(i) !== 46) return false;
  const fractionFrom = ++i;
  while (i < n && cell.charCodeAt(i) >= 48 && cell.charCodeAt(i) <= 57) i++;
  return i === n && i > fractionFrom;
}

/** Typed reads of one cell; each throws a {@link cellError} for a value that does not fit. */
export interface CellReader {
  /** Trimmed header names; `names[i]` is the column of cell `i`. */
  readonly names: readonly string[];
  /** A number, or null for an empty cell that is not `required`. */
  number(row: readonly string[], idx: number, line: number, required: boolean): number | null;
  /** A stud load in N as read (at most the joint's limit; below zero is judged by `zero.ts`). */
  load(row: readonly string[], idx: number, line: number, position: number): number;
  /** A whole stud position in 1..studCount. */
  position(row: readonly string[], idx: number, line: number): number;
  /** A number of 0 or more, or null when the column is not mapped (`idx < 0`) or the cell is empty. */
  optional(row: readonly string[], idx: number, line: number, what: string): number | null;
}

/**
 * Creates the cell reader for one file. For microstrain files it checks up front that the joint
 * gives what the conversion needs.
 *
 * @throws AppError('invalid_input') for a microstrain file on a joint without stress area or modulus.
 */
export function createCellReader(headers: readonly string[], loadUnit: LoadUnit, joint: JointForImport, decimalComma: boolean): CellReader {
  const N = joint.studCount;
  const limitSource = joint.maxStudLoadSource ?? "the joint's maximum stud load";
  const strainFor = (position: number): StrainConversion | undefined =>
    loadUnit === 'microstrain'
      ? {
          youngsModulusPa: joint.youngsModulusPa ?? Number.NaN,
          stressAreaM2: joint.stressAreaM2 ?? Number.NaN,
          calibrationFactor: joint.calibration?.[position - 1] ?? 1,
        }
      : undefined;
  if (loadUnit === 'microstrain') loadToN(0, 'microstrain', strainFor(1));
  const names = headers.map((h) => h.trim());

  const number = (row: readonly string[], idx: number, line: number, required: boolean): number | null => {
    const raw = row[idx] ?? '';
    if (!decimalComma && isPlainDecimal(raw)) return Number(raw);
    const r = readNumberCell(raw, decimalComma);
    if (r.kind === 'number') return r.value;
    if (r.kind === 'empty') {
      if (required) throw cellError(line, names[idx]!, 'the cell is empty; a number is needed here.');
      return null;
    }
    throw cellError(line, names[idx]!, `${quoteInput(raw)} ${r.reason}.`);
  };
  return {
    names,
    number,
    load(row, idx, line, position) {
      const v = number(row, idx, line, true)!;
      const n = loadToN(v, loadUnit, strainFor(position));
      if (n > joint.maxStudLoadN) {
        throw cellError(line, names[idx]!, `${formatLoadN(n)} is above the limit of ${formatLoadN(joint.maxStudLoadN)} (${limitSource}); check the load unit (${loadUnit}).`);
      }
      return n;
    },
    position(row, idx, line) {
      const v = number(row, idx, line, true)!;
      if (!Number.isInteger(v)) throw cellError(line, names[idx]!, `${quoteInput(row[idx]!)} is not a whole stud position.`);
      if (v < 1 || v > N) throw cellError(line, names[idx]!, `position ${v} is outside 1..${N} (the joint has ${N} studs).`);
      return v;
    },
    optional(row, idx, line, what) {
      if (idx < 0) return null;
      const v = number(row, idx, line, false);
      if (v !== null && v < 0) throw cellError(line, names[idx]!, `${quoteInput(row[idx]!)} is a negative ${what}.`);
      return v;
    },
  };
}
