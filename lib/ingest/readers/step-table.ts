/**
 * Step tables: one row per stud reading after each step (pass, step, position, load). Consecutive
 * rows with the same (pass, step) form a step, which must list every position exactly once (no
 * carrying forward: a step table is a record, not a scan).
 */
import { clipInput } from '../text-limits';
import { cellError, listPositions, missingPositions, type CellReader } from './cells';
import type { ColumnIndexes } from './columns';
import type { RowExtrasReader } from './row-extras';
import { emptyStep, type StepCollector } from './steps';
import type { PendingStep, ShapeReader } from './types';
import type { ZeroCorrector } from './zero';

/** Creates the step-table reader for a joint of `studCount` studs. */
export function createStepTableReader(cells: CellReader, columns: ColumnIndexes, extras: RowExtrasReader, studCount: number, collector: StepCollector, zero: ZeroCorrector): ShapeReader {
  const positionName = cells.names[columns.position]!;
  let table: (PendingStep & { key: string; seen: Int32Array }) | null = null;

  const closeTableStep = () => {
    if (!table) return;
    const missing = missingPositions(table.seen, (l) => l === 0);
    if (missing.length > 0) {
      throw cellError(table.lastLine, positionName, `step ${clipInput(table.label)} (lines ${table.firstLine}–${table.lastLine}) has no reading for position${missing.length === 1 ? '' : 's'} ${listPositions(missing)}; a step table lists every stud after every step.`);
    }
    collector.close(table);
  };

  return {
    read(row, line, e) {
      const position = cells.position(row, columns.position, line);
      const load = zero.nearZero(cells.load(row, columns.load, line, position), line, cells.names[columns.load]!);
      const timeS = extras.time(row, line, false);
      if (!table || table.key !== e.key) {
        closeTableStep();
        table = { ...emptyStep(studCount, line, e.label), key: e.key, seen: new Int32Array(studCount) };
      }
      const seenAt = table.seen[position - 1]!;
      if (seenAt > 0) throw cellError(line, positionName, `position ${position} appears twice in step ${clipInput(table.label)} (lines ${seenAt} and ${line}).`);
      table.seen[position - 1] = line;
      table.loads[position - 1] = load;
      table.lastLine = line;
      table.pass = e.pass;
      if (timeS !== null) table.timeS = timeS;
      if (e.torque !== null) table.torque = e.torque;
      if (e.pressure !== null) table.pressure = e.pressure;
      if (e.tightened !== null) table.tightened = e.tightened;
    },
    close: closeTableStep,
  };
}
