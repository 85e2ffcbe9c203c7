/**
 * Normalised CSV export of a run: one row per reading (every stud after every step), in SI or US
 * units. The file is a step table that {@link parseLoggerText} reads back to the same readings.
 *
 * Cells are written by the one CSV writer, lib/export/write-csv.ts (formula escape rule there).
 */
import type { NormalisedRun } from '@/lib/record/run-types';
import { csvRows, type CsvValue } from '@/lib/export/write-csv';
import { csvLoad } from '@/lib/export/load-resolution';
import { nmToTorque } from './units';

/** Unit system of an export. */
export type ExportUnits = 'si' | 'us';

/** What the export needs besides the run. */
export interface RunCsvMeta {
  /** Run identifier written on every row (text is neutralised like any cell). */
  runId: string | number;
}

/**
 * Writes the run as CSV with CRLF line endings and the columns
 * `run_id, step, pass, tightened_position, position, load_N|load_lbf,
 * applied_torque_Nm|applied_torque_ft-lb, applied_pressure_bar, time_s`
 * (`applied_pressure_bar` is our addition so hydraulic runs keep their pressures; bar in both unit systems).
 * Loads are written to what the instrument resolves (`csvLoad`: 10 N or 1 lbf), so re-importing gives
 * the readings to within half that step; other numbers keep full precision (`String(n)`).
 */
export function runToCsv(run: NormalisedRun, meta: RunCsvMeta, units: ExportUnits): string {
  const us = units === 'us';
  const rows: CsvValue[][] = [['run_id', 'step', 'pass', 'tightened_position', 'position', us ? 'load_lbf' : 'load_N', us ? 'applied_torque_ft-lb' : 'applied_torque_Nm', 'applied_pressure_bar', 'time_s']];
  for (const step of run.steps) {
    const torque = step.appliedTorqueNm == null ? null : nmToTorque(step.appliedTorqueNm, us ? 'ft-lb' : 'N·m');
    step.loadsN.forEach((loadN, i) => {
      rows.push([meta.runId, step.order, step.pass, step.position, i + 1, csvLoad(loadN, units), torque, step.appliedPressureBar, step.timeS]);
    });
  }
  return csvRows(rows);
}
