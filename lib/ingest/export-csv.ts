/**
 * Normalised CSV export of a run: one row per reading (every stud after every step), in SI or US
 * units. The file is a step table that {@link parseLoggerText} reads back to the same readings.
 *
 * Formula injection (common practice, after the OWASP "CSV Injection" note, from memory): a
 * spreadsheet runs a cell that starts with `=`, `+`, `-`, `@`, tab or CR as a formula. We
 * neutralise **only non-numeric text cells** with such a start by prefixing a single quote `'`;
 * cells that are plain numbers (e.g. `-0.5`, `1e-3`) stay numeric, since a number cannot run as a
 * formula and quoting it would break the round trip and spreadsheet arithmetic.
 */
import type { NormalisedRun } from '@/lib/record/run-types';
import { NEWTONS_PER_LBF, nmToTorque } from './units';

/** Unit system of an export. */
export type ExportUnits = 'si' | 'us';

/** What the export needs besides the run. */
export interface RunCsvMeta {
  /** Run identifier written on every row (text is neutralised like any cell). */
  runId: string | number;
}

const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Makes one cell safe and valid CSV: a non-numeric cell starting with `=`, `+`, `-`, `@`, tab or
 * CR gets a leading `'`; then cells with a comma, quote, CR, LF or edge spaces are quoted (RFC 4180).
 *
 * @example neutraliseCsvCell('=HYPERLINK("x")') // `"'=HYPERLINK(""x"")"`
 * @example neutraliseCsvCell('-12.5') // `-12.5`
 */
export function neutraliseCsvCell(value: string): string {
  let cell = value;
  if (!PLAIN_NUMBER.test(cell) && FORMULA_START.test(cell)) cell = `'${cell}`;
  if (/[",\r\n]/.test(cell) || cell !== cell.trim()) cell = `"${cell.replace(/"/g, '""')}"`;
  return cell;
}

function numberCell(n: number | null | undefined): string {
  return n === null || n === undefined ? '' : String(n);
}

/**
 * Writes the run as CSV with CRLF line endings and the columns
 * `run_id, step, pass, tightened_position, position, load_N|load_lbf,
 * applied_torque_Nm|applied_torque_ft-lb, applied_pressure_bar, time_s`
 * (`applied_pressure_bar` is our addition so hydraulic runs keep their pressures; bar in both unit systems).
 * Numbers are written with full precision (`String(n)`), so re-importing gives the same readings
 * (exactly in SI; to within floating-point rounding of the lbf factor in US units).
 */
export function runToCsv(run: NormalisedRun, meta: RunCsvMeta, units: ExportUnits): string {
  const us = units === 'us';
  const header = ['run_id', 'step', 'pass', 'tightened_position', 'position', us ? 'load_lbf' : 'load_N', us ? 'applied_torque_ft-lb' : 'applied_torque_Nm', 'applied_pressure_bar', 'time_s'];
  const lines = [header.join(',')];
  const runId = neutraliseCsvCell(String(meta.runId));
  for (const step of run.steps) {
    const torque = step.appliedTorqueNm == null ? '' : numberCell(nmToTorque(step.appliedTorqueNm, us ? 'ft-lb' : 'N·m'));
    step.loadsN.forEach((loadN, i) => {
      const load = us ? loadN / NEWTONS_PER_LBF : loadN;
      lines.push([runId, String(step.order), String(step.pass), String(step.position), String(i + 1), numberCell(load), torque, numberCell(step.appliedPressureBar), numberCell(step.timeS)].join(','));
    });
  }
  return `${lines.join('\r\n')}\r\n`;
}
