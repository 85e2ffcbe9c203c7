/**
 * Wide files: one row per scan, one load column per stud. Each row is a snapshot of every stud.
 */
import { AppError } from '@/lib/http/errors';
import type { ColumnMapping } from '../shapes';
import { quoteInput } from '../text-limits';
import { cellError, listPositions, missingPositions, type CellReader } from './cells';
import { columnIndex } from './columns';
import type { RowExtrasReader } from './row-extras';
import type { SnapshotSink } from './snapshots';
import type { ShapeReader } from './types';
import type { ZeroCorrector } from './zero';

/**
 * Which column holds which position (index 0 = position 1).
 *
 * @throws AppError('invalid_input') for a position outside 1..studCount, a position or column
 *   mapped twice, or a position without a column.
 */
export function studColumnIndexes(names: readonly string[], studColumns: ColumnMapping['studColumns'], studCount: number, headerLine: number): Int32Array {
  const N = studCount;
  const studIdx = new Int32Array(N).fill(-1);
  const byPosition = new Map<number, string>();
  for (const s of studColumns) {
    const i = columnIndex(names, s.column, headerLine);
    if (s.position < 1 || s.position > N) throw cellError(headerLine, s.column, `position ${s.position} is outside 1..${N} (the joint has ${N} studs).`);
    const prev = byPosition.get(s.position);
    if (prev !== undefined) throw cellError(headerLine, s.column, `position ${s.position} is mapped twice (${quoteInput(prev)} and ${quoteInput(s.column)}).`);
    if (studIdx.includes(i)) throw cellError(headerLine, s.column, 'this column is mapped to two stud positions.');
    byPosition.set(s.position, s.column);
    studIdx[s.position - 1] = i;
  }
  const missing = missingPositions(studIdx, (i) => i < 0);
  if (missing.length > 0) {
    throw new AppError(
      'invalid_input',
      `Line ${headerLine}: the joint has ${N} studs but the file has no load column for position${missing.length === 1 ? '' : 's'} ${listPositions(missing)}.`,
      { row: headerLine, missingPositions: missing },
    );
  }
  return studIdx;
}

/** Creates the wide reader; every row needs a time (when mapped) and a load for every stud. */
export function createWideReader(cells: CellReader, extras: RowExtrasReader, studIdx: Int32Array, sink: SnapshotSink, zero: ZeroCorrector): ShapeReader {
  const raw = new Float64Array(studIdx.length);
  const loads = new Float64Array(studIdx.length);
  const columnOf = (k: number) => cells.names[studIdx[k]!]!;
  return {
    read(row, line, e) {
      const timeS = extras.time(row, line, true);
      for (let k = 0; k < raw.length; k++) raw[k] = cells.load(row, studIdx[k]!, line, k + 1);
      zero.correct(raw, loads, () => line, columnOf);
      sink.take({ line, timeS, loadsN: loads, appliedTorqueNm: e.torque, appliedPressureBar: e.pressure, pass: e.pass, key: e.key, tightened: e.tightened });
    },
    close() {},
  };
}
