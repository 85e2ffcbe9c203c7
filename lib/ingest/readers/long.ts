/**
 * Long files: one row per stud reading (time, position, load). Rows are pivoted by time stamp
 * (time must not go backwards; rows with the same time form one snapshot). A stud missing from a
 * time stamp carries its last value forward, so the first time stamp must list every stud.
 */
import { cellError, listPositions, missingPositions, type CellReader } from './cells';
import type { ColumnIndexes } from './columns';
import type { RowExtrasReader } from './row-extras';
import type { SnapshotSink } from './snapshots';
import type { RowExtras, ShapeReader } from './types';
import type { ZeroCorrector } from './zero';

/** Creates the long reader for a joint of `studCount` studs. */
export function createLongReader(cells: CellReader, columns: ColumnIndexes, extras: RowExtrasReader, studCount: number, sink: SnapshotSink, zero: ZeroCorrector, stepPerStampAbove: number | null = null): ShapeReader {
  const positionName = cells.names[columns.position]!;
  const loadName = cells.names[columns.load]!;
  const loads = new Float64Array(studCount).fill(Number.NaN);
  const corrected = new Float64Array(studCount);
  const seen = new Int32Array(studCount);
  let time: number | null = null;
  let firstLine = 0;
  let lastLine = 0;
  let stamp: Omit<RowExtras, 'label'> | null = null;
  let stamps = 0;

  const closeTimeStamp = () => {
    if (time === null || !stamp) return;
    const missing = missingPositions(loads, Number.isNaN);
    if (missing.length > 0) {
      throw cellError(firstLine, positionName, `time ${time} s has no reading for position${missing.length === 1 ? '' : 's'} ${listPositions(missing)} (the first time stamp must list every stud; later ones carry the last value forward).`);
    }
    zero.correct(loads, corrected, (k) => seen[k]!, () => loadName);
    let key = stamp.key;
    if (stepPerStampAbove !== null) {
      // Each time stamp is a step; the first is the at-rest baseline when no stud is above the step threshold.
      const atRest = stamps === 0 && corrected.every((n) => n <= stepPerStampAbove);
      key = atRest ? '' : `t\u0000${time} s`;
    }
    stamps++;
    sink.take({ line: lastLine, timeS: time, loadsN: corrected, appliedTorqueNm: stamp.torque, appliedPressureBar: stamp.pressure, pass: stamp.pass, key, tightened: stamp.tightened });
    seen.fill(0);
  };

  return {
    read(row, line, e) {
      const position = cells.position(row, columns.position, line);
      const load = cells.load(row, columns.load, line, position);
      const t = extras.time(row, line, true)!;
      if (time === null || t > time) {
        closeTimeStamp();
        time = t;
        firstLine = line;
        stamp = { key: e.key, torque: null, pressure: null, tightened: null, pass: e.pass };
      }
      const seenAt = seen[position - 1]!;
      if (seenAt > 0) throw cellError(line, positionName, `position ${position} appears twice at time ${t} s (lines ${seenAt} and ${line}).`);
      seen[position - 1] = line;
      loads[position - 1] = load;
      lastLine = line;
      stamp!.key = e.key;
      stamp!.pass = e.pass;
      if (e.torque !== null) stamp!.torque = e.torque;
      if (e.pressure !== null) stamp!.pressure = e.pressure;
      if (e.tightened !== null) stamp!.tightened = e.tightened;
    },
    close: closeTimeStamp,
  };
}
