/**
 * Turning the data rows of a logger table into a `NormalisedRun` (loads in N, one step per
 * tightening, every stud's load after it). Streaming: {@link createRowNormaliser} takes one row at
 * a time (e.g. from papaparse's `step` callback) and keeps O(studCount) state per row, so a file
 * of 1,000,000 readings is never held as row objects. {@link normaliseRows} is a thin wrapper.
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
 *   rose most from the previous reading (a warning says when no load rose).
 * - Pass numbers come from the pass column; without one, a new pass starts when a stud already
 *   tightened in the current pass is tightened again.
 */
import { AppError } from '@/lib/http/errors';
import type { NormalisedRun, NormalisedStep } from '@/lib/record/run-types';
import { readNumberCell } from './numbers';
import { clipInput, quoteInput } from './text-limits';
import type { ColumnMapping } from './shapes';
import { loadToN, torqueToNm, type StrainConversion } from './units';
import { assignPasses, createStepDeriver, type DeriveStepsOptions, type DerivedStep, type Snapshot, type StepDeriver } from './derive-steps';

/** What the import needs to know about the joint the run was recorded on. */
export interface JointForImport {
  studCount: number;
  /** Target stud load in N. */
  targetLoadN: number;
  /** Largest believable stud load in N; anything above is rejected as absurd. */
  maxStudLoadN: number;
  /** Where `maxStudLoadN` comes from, for the message, e.g. `1.2 × the stud's minimum tensile load of 156 kN`. */
  maxStudLoadSource?: string;
  /** Per-position calibration factor for microstrain files (index 0 = position 1); default all 1. */
  calibration?: number[];
  /** Stress area at the gauges in m², needed for microstrain files. */
  stressAreaM2?: number;
  /** Young's modulus of the studs in Pa, needed for microstrain files. */
  youngsModulusPa?: number;
}

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
}

/** Lines a step was read from. */
export interface StepLines {
  order: number;
  firstLine: number;
  lastLine: number;
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
}

/** A streaming normaliser: push every data row with its file line number, then finish. */
export interface RowNormaliser {
  /** Reads one data row. Blank rows are skipped. @throws AppError('invalid_input') naming line and column. */
  push(row: readonly string[], lineNumber: number): void;
  /** Closes the last step and returns the run. @throws AppError('invalid_input') for no data or no steps. */
  finish(): NormaliseResult;
}

function fmtN(n: number): string {
  return Math.abs(n) >= 1000 ? `${+(n / 1000).toPrecision(6)} kN` : `${+n.toPrecision(6)} N`;
}

function ranges(positions: number[]): string {
  return positions.join(', ');
}

function bad(line: number, column: string, message: string): AppError {
  const name = quoteInput(column);
  return new AppError('invalid_input', `Line ${line}, column ${name}: ${message}`, { row: line, column: name.slice(1, -1) });
}

interface PendingStep {
  firstLine: number;
  lastLine: number;
  loads: Float64Array;
  timeS: number | null;
  torque: number | null;
  pressure: number | null;
  pass: number | null;
  tightened: number | null;
  label: string;
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
  if (!(Number.isInteger(N) && N >= 1)) throw new AppError('invalid_input', `The joint's stud count must be a whole number of 1 or more, got ${N}.`, { field: 'studCount' });
  if (!(joint.targetLoadN > 0)) throw new AppError('invalid_input', `The joint's target load must be positive, got ${joint.targetLoadN} N.`, { field: 'targetLoadN' });
  if (!(joint.maxStudLoadN > 0)) throw new AppError('invalid_input', `The joint's maximum stud load must be positive, got ${joint.maxStudLoadN} N.`, { field: 'maxStudLoadN' });
  if (joint.calibration && joint.calibration.length !== N) {
    throw new AppError('invalid_input', `The joint has ${N} studs but ${joint.calibration.length} calibration factors.`, { field: 'calibration' });
  }
  const limitSource = joint.maxStudLoadSource ?? "the joint's maximum stud load";
  const strainFor = (position: number): StrainConversion | undefined =>
    mapping.loadUnit === 'microstrain'
      ? {
          youngsModulusPa: joint.youngsModulusPa ?? Number.NaN,
          stressAreaM2: joint.stressAreaM2 ?? Number.NaN,
          calibrationFactor: joint.calibration?.[position - 1] ?? 1,
        }
      : undefined;
  if (mapping.loadUnit === 'microstrain') loadToN(0, 'microstrain', strainFor(1));

  const names = headers.map((h) => h.trim());
  const indexOf = (name: string | null): number => {
    if (name === null) return -1;
    const at: number[] = [];
    names.forEach((h, i) => {
      if (h === name.trim()) at.push(i);
    });
    if (at.length === 0) throw bad(headerLine, name, 'the mapping names this column but the header has no such column.');
    if (at.length > 1) throw bad(headerLine, name, `the header has ${at.length} columns with this name (columns ${at.map((i) => i + 1).join(' and ')}); rename one.`);
    return at[0]!;
  };
  const timeIdx = indexOf(mapping.timeColumn);
  const stepIdx = indexOf(mapping.stepColumn);
  const passIdx = indexOf(mapping.passColumn);
  const torqueIdx = indexOf(mapping.torqueColumn);
  const pressureIdx = indexOf(mapping.pressureColumn);
  const tightIdx = indexOf(mapping.tightenedColumn);
  const shape = mapping.shape;
  const posIdx = shape === 'wide' ? -1 : indexOf(mapping.positionColumn);
  const loadIdx = shape === 'wide' ? -1 : indexOf(mapping.loadColumn);
  if (shape !== 'wide' && (posIdx < 0 || loadIdx < 0)) {
    throw new AppError('invalid_input', `A ${shape === 'long' ? 'long table' : 'step table'} needs a position column and a load column.`, { field: 'mapping' });
  }
  if (shape === 'long' && timeIdx < 0) throw new AppError('invalid_input', 'A long table needs a time column.', { field: 'timeColumn' });
  if (shape === 'step_table' && stepIdx < 0) throw new AppError('invalid_input', 'A step table needs a step column.', { field: 'stepColumn' });

  // Wide: which column holds which position.
  const studIdx = new Int32Array(N).fill(-1);
  if (shape === 'wide') {
    const byPosition = new Map<number, string>();
    for (const s of mapping.studColumns) {
      const i = indexOf(s.column);
      if (s.position < 1 || s.position > N) throw bad(headerLine, s.column, `position ${s.position} is outside 1..${N} (the joint has ${N} studs).`);
      const prev = byPosition.get(s.position);
      if (prev !== undefined) throw bad(headerLine, s.column, `position ${s.position} is mapped twice (${quoteInput(prev)} and ${quoteInput(s.column)}).`);
      if (studIdx.includes(i)) throw bad(headerLine, s.column, 'this column is mapped to two stud positions.');
      byPosition.set(s.position, s.column);
      studIdx[s.position - 1] = i;
    }
    const missing: number[] = [];
    studIdx.forEach((i, k) => {
      if (i < 0) missing.push(k + 1);
    });
    if (missing.length > 0) {
      throw new AppError(
        'invalid_input',
        `Line ${headerLine}: the joint has ${N} studs but the file has no load column for position${missing.length === 1 ? '' : 's'} ${ranges(missing)}.`,
        { row: headerLine, missingPositions: missing },
      );
    }
  }

  const warnings: string[] = [];
  const steps: NormalisedStep[] = [];
  const stepLines: StepLines[] = [];
  const passesGiven: (number | null)[] = [];
  let rowCount = 0;
  let lastTime = Number.NEGATIVE_INFINITY;
  let lastTimeLine = 0;
  let markerStep = '';
  let markerPass: number | null = null;
  let hasMarker = false;

  const num = (row: readonly string[], idx: number, line: number, required: boolean): number | null => {
    const raw = row[idx] ?? '';
    const r = readNumberCell(raw, options.decimalComma);
    if (r.kind === 'number') return r.value;
    if (r.kind === 'empty') {
      if (required) throw bad(line, names[idx]!, 'the cell is empty; a number is needed here.');
      return null;
    }
    throw bad(line, names[idx]!, `${quoteInput(raw)} ${r.reason}.`);
  };
  const loadN = (row: readonly string[], idx: number, line: number, position: number): number => {
    const v = num(row, idx, line, true)!;
    if (v < 0) throw bad(line, names[idx]!, `${quoteInput(row[idx]!)} is a negative load; stud loads must be 0 or more.`);
    const n = loadToN(v, mapping.loadUnit, strainFor(position));
    if (n > joint.maxStudLoadN) {
      throw bad(line, names[idx]!, `${fmtN(n)} is above the limit of ${fmtN(joint.maxStudLoadN)} (${limitSource}); check the load unit (${mapping.loadUnit}).`);
    }
    return n;
  };
  const positionOf = (row: readonly string[], idx: number, line: number): number => {
    const v = num(row, idx, line, true)!;
    if (!Number.isInteger(v)) throw bad(line, names[idx]!, `${quoteInput(row[idx]!)} is not a whole stud position.`);
    if (v < 1 || v > N) throw bad(line, names[idx]!, `position ${v} is outside 1..${N} (the joint has ${N} studs).`);
    return v;
  };
  const optionalNumber = (row: readonly string[], idx: number, line: number, what: string): number | null => {
    if (idx < 0) return null;
    const v = num(row, idx, line, false);
    if (v !== null && v < 0) throw bad(line, names[idx]!, `${quoteInput(row[idx]!)} is a negative ${what}.`);
    return v;
  };
  /** Reads the markers of a row; returns the marker key ('' = before the first marker). */
  const readMarker = (row: readonly string[], line: number): string => {
    if (passIdx >= 0) {
      const raw = (row[passIdx] ?? '').trim();
      if (raw !== '') {
        const r = readNumberCell(raw, options.decimalComma);
        if (r.kind !== 'number' || !Number.isInteger(r.value) || r.value < 1) {
          throw bad(line, names[passIdx]!, `${quoteInput(raw)} is not a pass number (1, 2, 3, ...).`);
        }
        markerPass = r.value;
      }
    }
    if (stepIdx >= 0) {
      const raw = (row[stepIdx] ?? '').trim();
      if (raw !== '') {
        markerStep = raw;
        hasMarker = true;
      } else if (shape === 'step_table' && !hasMarker) {
        throw bad(line, names[stepIdx]!, 'the step cell is empty on the first data row.');
      }
    }
    return hasMarker ? `${markerPass ?? ''}\u0000${markerStep}` : '';
  };

  // ---- step output ----
  let previousReading: Float64Array = new Float64Array(N);
  const closeStep = (p: PendingStep) => {
    let position = p.tightened;
    if (position === null) {
      let best = -1;
      let rise = Number.NEGATIVE_INFINITY;
      for (let k = 0; k < N; k++) {
        const d = p.loads[k]! - previousReading[k]!;
        if (d > rise) {
          rise = d;
          best = k;
        }
      }
      position = best + 1;
      if (!(rise > 0)) warnings.push(`Lines ${p.firstLine}–${p.lastLine}: no stud load rose in step ${clipInput(p.label)}; tightened position ${position} is a guess.`);
    }
    const order = steps.length + 1;
    steps.push({
      order,
      pass: p.pass ?? 0,
      position,
      appliedTorqueNm: p.torque,
      appliedPressureBar: p.pressure,
      timeS: p.timeS,
      loadsN: Array.from(p.loads),
    });
    passesGiven.push(p.pass);
    stepLines.push({ order, firstLine: p.firstLine, lastLine: p.lastLine });
    previousReading = p.loads;
  };

  // ---- snapshots (wide and long) -> marker segments or the deriver ----
  const deriver: StepDeriver | null = stepIdx < 0 && shape !== 'step_table' ? createStepDeriver(N, { ...options.derive, targetLoadN: joint.targetLoadN }) : null;
  let segment: (PendingStep & { key: string }) | null = null;
  let baseline: Float64Array | null = null;
  const copyInto = (to: Float64Array, from: ArrayLike<number>) => {
    for (let k = 0; k < N; k++) to[k] = from[k]!;
  };
  const takeSnapshot = (s: Snapshot & { key: string; tightened: number | null }) => {
    if (deriver) {
      deriver.push(s);
      return;
    }
    if (s.key === '') {
      baseline ??= new Float64Array(N);
      copyInto(baseline, s.loadsN);
      return;
    }
    if (!segment || segment.key !== s.key) {
      if (segment) closeStep(segment);
      else {
        previousReading = new Float64Array(N);
        copyInto(previousReading, baseline ?? s.loadsN);
      }
      segment = { key: s.key, label: s.key.split('\u0000')[1] ?? '', firstLine: s.line, lastLine: s.line, loads: new Float64Array(N), timeS: null, torque: null, pressure: null, pass: null, tightened: null };
    }
    copyInto(segment.loads, s.loadsN);
    segment.lastLine = s.line;
    segment.timeS = s.timeS;
    segment.pass = s.pass ?? null;
    if (s.appliedTorqueNm != null) segment.torque = s.appliedTorqueNm;
    if (s.appliedPressureBar != null) segment.pressure = s.appliedPressureBar;
    if (s.tightened !== null) segment.tightened = s.tightened;
  };

  const readTime = (row: readonly string[], line: number, required: boolean): number | null => {
    if (timeIdx < 0) return null;
    const t = num(row, timeIdx, line, required);
    if (t === null) return null;
    if (t < lastTime) throw bad(line, names[timeIdx]!, `time goes backwards (${t} s after ${lastTime} s on line ${lastTimeLine}).`);
    lastTime = t;
    lastTimeLine = line;
    return t;
  };

  // wide
  const wideLoads = new Float64Array(N);
  // long: current time stamp
  const longLoads = new Float64Array(N).fill(Number.NaN);
  const longSeen = new Int32Array(N);
  let longTime: number | null = null;
  let longFirst = 0;
  let longLast = 0;
  let longExtras: { key: string; torque: number | null; pressure: number | null; tightened: number | null; pass: number | null } | null = null;
  const closeTimeStamp = () => {
    if (longTime === null || !longExtras) return;
    const missing: number[] = [];
    longLoads.forEach((v, k) => {
      if (Number.isNaN(v)) missing.push(k + 1);
    });
    if (missing.length > 0) {
      throw bad(longFirst, names[posIdx]!, `time ${longTime} s has no reading for position${missing.length === 1 ? '' : 's'} ${ranges(missing)} (the first time stamp must list every stud; later ones carry the last value forward).`);
    }
    takeSnapshot({ line: longLast, timeS: longTime, loadsN: longLoads, appliedTorqueNm: longExtras.torque, appliedPressureBar: longExtras.pressure, pass: longExtras.pass, key: longExtras.key, tightened: longExtras.tightened });
    longSeen.fill(0);
  };
  // step table: current step
  let table: (PendingStep & { key: string; seen: Int32Array }) | null = null;
  const closeTableStep = () => {
    if (!table) return;
    const missing: number[] = [];
    table.seen.forEach((l, k) => {
      if (l === 0) missing.push(k + 1);
    });
    if (missing.length > 0) {
      throw bad(table.lastLine, names[posIdx]!, `step ${clipInput(table.label)} (lines ${table.firstLine}–${table.lastLine}) has no reading for position${missing.length === 1 ? '' : 's'} ${ranges(missing)}; a step table lists every stud after every step.`);
    }
    closeStep(table);
  };

  const tightenedOf = (row: readonly string[], line: number): number | null => {
    if (tightIdx < 0 || (row[tightIdx] ?? '').trim() === '') return null;
    return positionOf(row, tightIdx, line);
  };

  return {
    push(row, line) {
      if (row.every((c) => c.trim() === '')) return;
      if (row.length < names.length) {
        throw bad(line, names[row.length]!, `the row has ${row.length} cells but the header (line ${headerLine}) has ${names.length}; this column is missing.`);
      }
      if (row.length > names.length && row.slice(names.length).some((c) => c.trim() !== '')) {
        throw bad(line, `column ${names.length + 1}`, `the row has ${row.length} cells but the header (line ${headerLine}) has ${names.length}.`);
      }
      rowCount++;
      const key = readMarker(row, line);
      const torqueRaw = optionalNumber(row, torqueIdx, line, 'torque');
      const torque = torqueRaw === null ? null : torqueToNm(torqueRaw, mapping.torqueUnit);
      const pressure = optionalNumber(row, pressureIdx, line, 'pressure');
      const tightened = tightenedOf(row, line);
      const pass = markerPass;
      if (shape === 'wide') {
        const timeS = readTime(row, line, true);
        for (let k = 0; k < N; k++) wideLoads[k] = loadN(row, studIdx[k]!, line, k + 1);
        takeSnapshot({ line, timeS, loadsN: wideLoads, appliedTorqueNm: torque, appliedPressureBar: pressure, pass, key, tightened });
        return;
      }
      const position = positionOf(row, posIdx, line);
      const load = loadN(row, loadIdx, line, position);
      if (shape === 'long') {
        const t = readTime(row, line, true)!;
        if (longTime === null || t > longTime) {
          closeTimeStamp();
          longTime = t;
          longFirst = line;
          longExtras = { key, torque: null, pressure: null, tightened: null, pass };
        }
        const seenAt = longSeen[position - 1]!;
        if (seenAt > 0) throw bad(line, names[posIdx]!, `position ${position} appears twice at time ${t} s (lines ${seenAt} and ${line}).`);
        longSeen[position - 1] = line;
        longLoads[position - 1] = load;
        longLast = line;
        longExtras!.key = key;
        longExtras!.pass = pass;
        if (torque !== null) longExtras!.torque = torque;
        if (pressure !== null) longExtras!.pressure = pressure;
        if (tightened !== null) longExtras!.tightened = tightened;
        return;
      }
      // step table
      const timeS = readTime(row, line, false);
      if (!table || table.key !== key) {
        closeTableStep();
        table = { key, label: markerStep, seen: new Int32Array(N), firstLine: line, lastLine: line, loads: new Float64Array(N), timeS: null, torque: null, pressure: null, pass: null, tightened: null };
      }
      const seenAt = table.seen[position - 1]!;
      if (seenAt > 0) throw bad(line, names[posIdx]!, `position ${position} appears twice in step ${clipInput(table.label)} (lines ${seenAt} and ${line}).`);
      table.seen[position - 1] = line;
      table.loads[position - 1] = load;
      table.lastLine = line;
      table.pass = pass;
      if (timeS !== null) table.timeS = timeS;
      if (torque !== null) table.torque = torque;
      if (pressure !== null) table.pressure = pressure;
      if (tightened !== null) table.tightened = tightened;
    },

    finish() {
      if (rowCount === 0) {
        throw new AppError('invalid_input', `Line ${headerLine}: the file has a header but no data rows below it.`, { row: headerLine });
      }
      if (shape === 'long') closeTimeStamp();
      if (shape === 'step_table') closeTableStep();
      if (segment) closeStep(segment);
      let derived: DerivedStep[] = [];
      if (deriver) {
        const d = deriver.finish();
        derived = d.steps;
        warnings.push(...d.warnings);
        for (const s of derived) {
          steps.push({ order: s.order, pass: s.pass, position: s.position, appliedTorqueNm: s.appliedTorqueNm, appliedPressureBar: s.appliedPressureBar, timeS: s.timeS, loadsN: s.loadsN });
          stepLines.push({ order: s.order, firstLine: s.firstLine, lastLine: s.lastLine });
        }
        if (derived.length > 0) {
          warnings.push(
            `No step column: ${derived.length} steps derived from the loads (a rise of more than ${(options.derive?.thresholdFraction ?? 0.02) * 100} % of the target on one stud is a step${passIdx < 0 ? '; a new pass starts when a stud already tightened in the pass is tightened again' : ''}). Confirm them.`,
          );
        }
      } else if (passesGiven.every((p) => p === null)) {
        const passes = assignPasses(steps.map((s) => s.position));
        steps.forEach((s, i) => (s.pass = passes[i]!));
        if (steps.length > 0) warnings.push('No pass column: a new pass starts when a stud already tightened in the pass is tightened again.');
      } else {
        let last = 1;
        steps.forEach((s, i) => {
          s.pass = passesGiven[i] ?? last;
          last = s.pass;
        });
      }
      if (steps.length === 0) {
        const threshold = (options.derive?.thresholdFraction ?? 0.02) * joint.targetLoadN;
        throw new AppError(
          'invalid_input',
          `Line ${options.firstDataLine}: no steps found. No single stud's load rose by more than ${fmtN(threshold)} (${(options.derive?.thresholdFraction ?? 0.02) * 100} % of the target); add a step column or check the load unit.`,
          { row: options.firstDataLine },
        );
      }
      return { run: { studCount: N, targetLoadN: joint.targetLoadN, steps }, derivedSteps: deriver !== null, derived, stepLines, warnings, rowCount };
    },
  };
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
