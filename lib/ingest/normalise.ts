/**
 * Turning the data rows of a logger table into a `NormalisedRun` (loads in N, one step per
 * tightening, every stud's load after it). Streaming: {@link createRowNormaliser} takes one row at
 * a time (e.g. from papaparse's `step` callback) and keeps O(studCount) state per row, so a file
 * of 1,000,000 readings is never held as row objects. {@link normaliseRows} is a thin wrapper.
 *
 * Each file shape has its own small reader in `readers/` (`wide.ts`, `long.ts`, `step-table.ts`);
 * this file checks the joint, finds the columns, reads what every row shares and turns the closed
 * steps into the result.
 *
 * How steps are read (our rules):
 * - **Marker steps** (wide or long with a step column): a step is a run of consecutive rows with
 *   the same (pass, step) marker; a blank marker cell carries the previous marker forward, and
 *   rows before the first marker are a baseline, not a step. The reading is the snapshot of every
 *   stud at the step's last row.
 * - **Long shape**: rows are pivoted by time stamp (time must not go backwards; rows with the
 *   same time form one snapshot). A stud missing from a time stamp **carries its last value
 *   forward**; the first time stamp must therefore list every stud.
 * - **Step table**: consecutive rows with the same (pass, step) form a step; each step must list
 *   every position exactly once (no carrying forward: a step table is a record, not a scan).
 * - **No step column**: steps are derived from the loads (see `derive-steps.ts`).
 * - The tightened stud is the tightened-position column when mapped, else the stud whose load
 *   rose most from the previous reading when one rose by more than the derivation threshold; in a
 *   step where none did (a check pass), the method's stud for that step when the steps so far follow
 *   the method's order and the snapshot shows that stud at load (`planStud`); else the stud that rose
 *   most, with a warning that it is a guess.
 * - Pass numbers come from the pass column; without one, a new pass starts when a stud already
 *   tightened in the current pass is tightened again.
 */
import { AppError } from '@/lib/http/errors';
import type { ColumnMapping } from './shapes';
import { assignPasses, createStepDeriver, type DeriveStepsOptions, type DeriveStepsResult, type DerivedStep, type StepDeriver } from './derive-steps';
import { cellError, createCellReader, formatLoadN } from './readers/cells';
import { resolveColumns } from './readers/columns';
import { createLongReader } from './readers/long';
import { createRowExtrasReader } from './readers/row-extras';
import { createSnapshotSink } from './readers/snapshots';
import { createStepCollector, type StepCollector, type StepLines } from './readers/steps';
import { createStepTableReader } from './readers/step-table';
import type { JointForImport, ShapeReader } from './readers/types';
import { createWideReader, studColumnIndexes } from './readers/wide';
import { createZeroCorrector } from './readers/zero';
import type { NormalisedRun } from '@/lib/record/run-types';

export type { JointForImport } from './readers/types';
export type { StepLines } from './readers/steps';

/** How the rows were laid out in the file. */
export interface NormaliseOptions {
  /** Numbers use a decimal comma (from `inspectText`). */
  decimalComma: boolean;
  /** Line number of the first data row (from `inspectText`). */
  firstDataLine: number;
  /** Line number of the header (default `firstDataLine - 1`). */
  headerLine?: number;
  /** Tuning of step derivation for files without a step column. */
  derive?: Omit<DeriveStepsOptions, 'targetLoadN'>;
  /** A long file without a step column whose time stamps each list every stud: each time stamp is a step (no derivation). */
  longStepPerTimeStamp?: boolean;
}

/** The normalised run and how it was obtained. */
export interface NormaliseResult {
  run: NormalisedRun;
  /** True when the steps were derived from the loads (no step column); show `derived` for confirmation. */
  derivedSteps: boolean;
  /** The derived steps with their row ranges (empty when the file had step markers). */
  derived: DerivedStep[];
  /** For every step, the file lines it was read from. */
  stepLines: StepLines[];
  warnings: string[];
  /** Data rows read (blank lines not counted). */
  rowCount: number;
  /** Zero offsets removed and readings inside the noise band, in words (`readers/zero.ts`). */
  zeroNotes: string[];
}

/** A streaming normaliser: push every data row with its file line number, then finish. */
export interface RowNormaliser {
  /** Reads one data row. Blank rows are skipped. @throws AppError('invalid_input') naming line and column. */
  push(row: readonly string[], lineNumber: number): void;
  /** Closes the last step and returns the run. @throws AppError('invalid_input') for no data or no steps. */
  finish(): NormaliseResult;
}

function checkJoint(joint: JointForImport): void {
  const N = joint.studCount;
  if (!(Number.isInteger(N) && N >= 1)) throw new AppError('invalid_input', `The joint's stud count must be a whole number of 1 or more, got ${N}.`, { field: 'studCount' });
  if (!(joint.targetLoadN > 0)) throw new AppError('invalid_input', `The joint's target load must be positive, got ${joint.targetLoadN} N.`, { field: 'targetLoadN' });
  if (!(joint.maxStudLoadN > 0)) throw new AppError('invalid_input', `The joint's maximum stud load must be positive, got ${joint.maxStudLoadN} N.`, { field: 'maxStudLoadN' });
  if (joint.calibration && joint.calibration.length !== N) {
    throw new AppError('invalid_input', `The joint has ${N} studs but ${joint.calibration.length} calibration factors.`, { field: 'calibration' });
  }
}

/**
 * Creates a streaming normaliser for one file. Checks the mapping against the header and the joint
 * up front (missing, duplicate or out-of-range stud columns), then every cell as rows arrive.
 *
 * @throws AppError('invalid_input') for a mapping that does not fit the header or the joint.
 */
export function createRowNormaliser(
  headers: readonly string[],
  mapping: ColumnMapping,
  joint: JointForImport,
  options: NormaliseOptions,
): RowNormaliser {
  const N = joint.studCount;
  const headerLine = options.headerLine ?? options.firstDataLine - 1;
  checkJoint(joint);
  const cells = createCellReader(headers, mapping.loadUnit, joint, options.decimalComma);
  const { names } = cells;
  const columns = resolveColumns(names, mapping, headerLine);
  const studIdx = mapping.shape === 'wide' ? studColumnIndexes(names, mapping.studColumns, N, headerLine) : null;

  const riseN = joint.targetLoadN * (options.derive?.thresholdFraction ?? 0.02);
  const collector = createStepCollector(N, { steps: joint.plannedSteps, riseN });
  const extras = createRowExtrasReader(cells, columns, mapping, options.decimalComma);
  const perStamp = mapping.shape === 'long' && columns.step < 0 && options.longStepPerTimeStamp === true;
  const deriver: StepDeriver | null = columns.step < 0 && mapping.shape !== 'step_table' && !perStamp ? createStepDeriver(N, { ...options.derive, targetLoadN: joint.targetLoadN }) : null;
  const sink = createSnapshotSink(N, collector, deriver);
  const zero = createZeroCorrector(N, joint.targetLoadN, mapping.tare ?? 'auto', (k) => (studIdx ? names[studIdx[k]!]! : `stud ${k + 1}`));
  const reader: ShapeReader = studIdx
    ? createWideReader(cells, extras, studIdx, sink, zero)
    : mapping.shape === 'long'
      ? createLongReader(cells, columns, extras, N, sink, zero, perStamp ? riseN : null)
      : createStepTableReader(cells, columns, extras, N, collector, zero);
  let rowCount = 0;

  return {
    push(row, line) {
      if (row.every((c) => c.trim() === '')) return;
      if (row.length < names.length) {
        throw cellError(line, names[row.length]!, `the row has ${row.length} cells but the header (line ${headerLine}) has ${names.length}; this column is missing.`);
      }
      if (row.length > names.length && row.slice(names.length).some((c) => c.trim() !== '')) {
        throw cellError(line, `column ${names.length + 1}`, `the row has ${row.length} cells but the header (line ${headerLine}) has ${names.length}.`);
      }
      rowCount++;
      reader.read(row, line, extras.read(row, line));
    },

    finish() {
      if (rowCount === 0) {
        throw new AppError('invalid_input', `Line ${headerLine}: the file has a header but no data rows below it.`, { row: headerLine });
      }
      reader.close();
      sink.close();
      const derived = deriver ? addDerivedSteps(deriver, collector, options, columns.pass >= 0, joint.plannedSteps) : [];
      if (!deriver) resolvePasses(collector);
      const { steps, stepLines, warnings } = collector;
      if (steps.length === 0) {
        const fraction = options.derive?.thresholdFraction ?? 0.02;
        throw new AppError(
          'invalid_input',
          `Line ${options.firstDataLine}: no steps found. No single stud's load rose by more than ${formatLoadN(fraction * joint.targetLoadN)} (${fraction * 100} % of the target); add a step column or check the load unit.`,
          { row: options.firstDataLine },
        );
      }
      const run: NormalisedRun = { studCount: N, targetLoadN: joint.targetLoadN, steps };
      return { run, derivedSteps: deriver !== null, derived, stepLines, warnings, rowCount, zeroNotes: zero.report() };
    },
  };
}

/** Moves the deriver's steps into the collector, with a warning asking to confirm them. */
function addDerivedSteps(deriver: StepDeriver, collector: StepCollector, options: NormaliseOptions, hasPassColumn: boolean, plan: JointForImport['plannedSteps']): DerivedStep[] {
  const d = deriver.finish();
  collector.warnings.push(...d.warnings);
  if (plan && !hasPassColumn) keepPlannedStepsAfterLastRise(d, plan, collector.warnings);
  for (const s of d.steps) {
    collector.steps.push({ order: s.order, pass: s.pass, position: s.position, appliedTorqueNm: s.appliedTorqueNm, appliedPressureBar: s.appliedPressureBar, timeS: s.timeS, loadsN: s.loadsN, covers: s.covers ?? null });
    collector.stepLines.push({ order: s.order, firstLine: s.firstLine, lastLine: s.lastLine });
  }
  if (d.steps.length > 0) {
    collector.warnings.push(
      `No step column: ${d.steps.length} steps derived from the loads (a rise of more than ${(options.derive?.thresholdFraction ?? 0.02) * 100} % of the target on one stud, or on several together, is a step; a released tool's step reads the load left after release${hasPassColumn ? '' : '; a new pass starts when a stud already tightened in the pass is tightened again'}). Confirm them.`,
    );
  }
  return d.steps;
}

/**
 * A check step takes time: the rows after the last rise hold the method's check-pass steps only
 * when they last at least this fraction of the median rows between the starts of the steps found,
 * per check step. A short hold after the last pull (the logger left running a second) is not a
 * check pass. Our rule.
 */
const CHECK_STEP_ROWS_FRACTION = 0.5;

/** The median number of rows from one derived step's first line to the next one's (1 for a single step). */
function medianRowsPerStep(steps: ReadonlyArray<{ firstLine: number }>): number {
  const gaps = steps.slice(1).map((s, i) => s.firstLine - steps[i]!.firstLine).sort((a, b) => a - b);
  if (gaps.length === 0) return 1;
  const mid = Math.floor(gaps.length / 2);
  return gaps.length % 2 ? gaps[mid]! : (gaps[mid - 1]! + gaps[mid]!) / 2;
}

/**
 * When the rises found are, in order, the method's first steps (same studs), the method's passes are
 * used, and the method's check-pass steps after the last rise (studs already at load, where no stud
 * rises) are kept as steps when the rows after the last rise last long enough for them
 * ({@link CHECK_STEP_ROWS_FRACTION}): their reading is the last row, their lines share out the rows
 * after the last rise. Our rule; a warning says so.
 */
function keepPlannedStepsAfterLastRise(d: DeriveStepsResult, plan: NonNullable<JointForImport['plannedSteps']>, warnings: string[]): void {
  const found = d.steps;
  if (found.length === 0 || found.length >= plan.length || !d.last) return;
  if (!found.every((s, i) => s.position === plan[i]!.position)) return;
  found.forEach((s, i) => (s.pass = plan[i]!.pass));
  const rest = plan.slice(found.length);
  if (!rest.every((p) => p.check)) return;
  const from = found[found.length - 1]!.lastLine + 1;
  const rows = d.last.line - from + 1;
  if (rows < rest.length * CHECK_STEP_ROWS_FRACTION * medianRowsPerStep(found)) return;
  rest.forEach((p, i) => {
    const firstLine = from + Math.floor((rows * i) / rest.length);
    const lastLine = i === rest.length - 1 ? d.last!.line : from + Math.floor((rows * (i + 1)) / rest.length) - 1;
    found.push({ order: found.length + 1, pass: p.pass, position: p.position, firstLine, lastLine, timeS: d.last!.timeS, loadsN: [...d.last!.loadsN], riseN: 0, appliedTorqueNm: null, appliedPressureBar: null });
  });
  warnings.push(`Steps ${found.length - rest.length + 1}–${found.length} (check pass): no stud rose after line ${from - 1}; kept because the method has these steps after the last rise. Their reading is the last row (line ${d.last.line}).`);
}

/**
 * Pass numbers of marker steps: from the pass column, a step without one taking the pass before it;
 * without a pass column, a new pass starts when a stud already tightened in the pass is tightened again.
 */
function resolvePasses(collector: StepCollector): void {
  const { steps, passesGiven } = collector;
  if (passesGiven.every((p) => p === null)) {
    const passes = assignPasses(steps.map((s) => s.position));
    steps.forEach((s, i) => (s.pass = passes[i]!));
    if (steps.length > 0) collector.warnings.push('No pass column: a new pass starts when a stud already tightened in the pass is tightened again.');
    return;
  }
  let last = 1;
  steps.forEach((s, i) => {
    s.pass = passesGiven[i] ?? last;
    last = s.pass;
  });
}

/**
 * Normalises rows already in memory; a thin wrapper over {@link createRowNormaliser}. Row `i` is
 * taken to be on file line `options.firstDataLine + i` (blank rows included in the count).
 *
 * @throws AppError('invalid_input') whose message names the line and column of the first bad value.
 */
export function normaliseRows(
  rows: readonly (readonly string[])[],
  headers: readonly string[],
  mapping: ColumnMapping,
  joint: JointForImport,
  options: NormaliseOptions,
): NormaliseResult {
  const n = createRowNormaliser(headers, mapping, joint, options);
  rows.forEach((row, i) => n.push(row, options.firstDataLine + i));
  return n.finish();
}
