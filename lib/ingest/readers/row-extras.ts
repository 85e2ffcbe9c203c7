/**
 * What every data row carries besides its loads: the step and pass markers, applied torque and
 * pressure, the tightened position, and the time (which must not go backwards).
 */
import type { ColumnMapping } from '../shapes';
import { readNumberCell } from '../numbers';
import { quoteInput } from '../text-limits';
import { torqueToNm } from '../units';
import { cellError, type CellReader } from './cells';
import type { ColumnIndexes } from './columns';
import type { RowExtras } from './types';

/** Reads the extras of each row in file order; keeps the current markers between rows. */
export interface RowExtrasReader {
  /** The row's extras. @throws AppError('invalid_input') for a bad marker, torque, pressure or position. */
  read(row: readonly string[], line: number): RowExtras;
  /** The row's time in s, or null when there is no time column (or an empty cell that is not `required`). */
  time(row: readonly string[], line: number, required: boolean): number | null;
}

/**
 * Creates the extras reader. Marker rules: a blank marker cell carries the previous marker forward;
 * rows before the first step marker have the key '' (a baseline); a step table must have a step
 * marker on its first data row.
 */
export function createRowExtrasReader(cells: CellReader, columns: ColumnIndexes, mapping: ColumnMapping, decimalComma: boolean): RowExtrasReader {
  const { names } = cells;
  let markerStep = '';
  let markerPass: number | null = null;
  let hasMarker = false;
  let lastTime = Number.NEGATIVE_INFINITY;
  let lastTimeLine = 0;

  const readPassMarker = (row: readonly string[], line: number) => {
    if (columns.pass < 0) return;
    const raw = (row[columns.pass] ?? '').trim();
    if (raw === '') return;
    const r = readNumberCell(raw, decimalComma);
    if (r.kind !== 'number' || !Number.isInteger(r.value) || r.value < 1) {
      throw cellError(line, names[columns.pass]!, `${quoteInput(raw)} is not a pass number (1, 2, 3, ...).`);
    }
    markerPass = r.value;
  };
  const readStepMarker = (row: readonly string[], line: number) => {
    if (columns.step < 0) return;
    const raw = (row[columns.step] ?? '').trim();
    if (raw !== '') {
      markerStep = raw;
      hasMarker = true;
    } else if (mapping.shape === 'step_table' && !hasMarker) {
      throw cellError(line, names[columns.step]!, 'the step cell is empty on the first data row.');
    }
  };

  return {
    read(row, line) {
      readPassMarker(row, line);
      readStepMarker(row, line);
      const key = hasMarker ? `${markerPass ?? ''}\u0000${markerStep}` : '';
      const torqueRaw = cells.optional(row, columns.torque, line, 'torque');
      const torque = torqueRaw === null ? null : torqueToNm(torqueRaw, mapping.torqueUnit);
      const pressure = cells.optional(row, columns.pressure, line, 'pressure');
      const tightened = columns.tightened < 0 || (row[columns.tightened] ?? '').trim() === '' ? null : cells.position(row, columns.tightened, line);
      return { key, label: markerStep, pass: markerPass, torque, pressure, tightened };
    },
    time(row, line, required) {
      if (columns.time < 0) return null;
      const t = cells.number(row, columns.time, line, required);
      if (t === null) return null;
      if (t < lastTime) throw cellError(line, names[columns.time]!, `time goes backwards (${t} s after ${lastTime} s on line ${lastTimeLine}).`);
      lastTime = t;
      lastTimeLine = line;
      return t;
    },
  };
}
