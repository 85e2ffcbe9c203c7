/**
 * Finding the steps in a time series of stud loads that has no step marker. Our own rule, stated
 * here so the UI can explain it next to the derived steps it shows for confirmation:
 *
 * 1. Each stud keeps a base: the lowest load it has had since the last step ended.
 * 2. A rise starts when exactly one stud is more than the threshold (default 2 % of the target
 *    load) above its base while no other stud is. Two or more studs rising together (simultaneous
 *    tools) is not counted; a warning names the line.
 * 3. The rise ends when the stud has not climbed by more than the noise band (default 0.1 % of
 *    target) for `settleRows` rows (default 5), when it falls more than the threshold below its
 *    peak (tool released), when another stud starts rising, or at the end of the data.
 * 4. The step's reading is the snapshot of every stud at the row where the rising stud peaked;
 *    its row range runs from the rising stud's base row (or the row after the previous step's
 *    reading, whichever is later, so ranges never overlap) to that peak row.
 * 5. Passes: when the file has no pass numbers, a new pass starts whenever a stud already
 *    tightened in the current pass is tightened again ({@link assignPasses}).
 *
 * Limits: a re-tightening that adds less than the threshold (a final check pass where nuts barely
 * turn) is not seen; a pause mid-pull longer than `settleRows` splits one pull into two steps;
 * for hydraulic tensioners the reading is the applied load at peak, not the residual after
 * load transfer. Files with a step column avoid all three.
 *
 * Memory is O(studCount) whatever the number of rows, so it runs inside a streaming import.
 */
import { AppError } from '@/lib/http/errors';

/** One scan of every stud (loads in N) as the deriver sees it. */
export interface Snapshot {
  /** 1-based file line of the row (for long files, the last row of the time stamp). */
  line: number;
  timeS: number | null;
  /** Load of every stud in N; index 0 = position 1. Copied when kept, so callers may reuse it. */
  loadsN: ArrayLike<number>;
  appliedTorqueNm?: number | null;
  appliedPressureBar?: number | null;
  /** Pass number from the file's pass column, when it has one. */
  pass?: number | null;
}

/** A step found by the deriver, with the rows it spans for the confirmation screen. */
export interface DerivedStep {
  order: number;
  pass: number;
  /** Position of the stud whose load rose. */
  position: number;
  /** Line of the rising stud's base (where the rise began). */
  firstLine: number;
  /** Line of the reading (the rising stud's peak). */
  lastLine: number;
  timeS: number | null;
  /** Snapshot of every stud at `lastLine`, in N. */
  loadsN: number[];
  /** How much the rising stud gained from its base to its peak, in N. */
  riseN: number;
  appliedTorqueNm: number | null;
  appliedPressureBar: number | null;
}

/** Tuning of the deriver. */
export interface DeriveStepsOptions {
  /** Target stud load in N; the threshold and noise band are fractions of it. */
  targetLoadN: number;
  /** A rise counts when it exceeds this fraction of the target (default 0.02 = 2 %). */
  thresholdFraction?: number;
  /** Rows without progress that end a rise (default 5). */
  settleRows?: number;
  /** Climbs smaller than this fraction of target are noise, not progress (default 0.001). */
  noiseFraction?: number;
}

/** Result of deriving steps. */
export interface DeriveStepsResult {
  steps: DerivedStep[];
  warnings: string[];
  /** The last snapshot pushed (null when none): the reading of steps after the last rise. */
  last: { line: number; timeS: number | null; loadsN: number[] } | null;
}

/** A streaming step deriver: push snapshots in row order, then finish. */
export interface StepDeriver {
  push(snapshot: Snapshot): void;
  finish(): DeriveStepsResult;
}

/**
 * Pass numbers for a sequence of tightened positions: pass 1 first, and a new pass whenever a
 * position already tightened in the current pass comes again. `[1,3,2,4,1,3,2,4]` → `[1,1,1,1,2,2,2,2]`.
 */
export function assignPasses(positions: readonly number[]): number[] {
  const seen = new Set<number>();
  let pass = 1;
  return positions.map((p) => {
    if (seen.has(p)) {
      pass++;
      seen.clear();
    }
    seen.add(p);
    return pass;
  });
}

interface Peak {
  position: number;
  firstLine: number;
  baseN: number;
  peakN: number;
  progressN: number;
  settle: number;
  snapshot: Float64Array;
  line: number;
  timeS: number | null;
  torque: number | null;
  pressure: number | null;
  pass: number | null;
}

/**
 * Creates a streaming deriver for `studCount` studs; see the module note for the rule.
 *
 * @throws AppError('invalid_input') for a non-positive target or stud count, or a snapshot of the wrong length.
 */
export function createStepDeriver(studCount: number, options: DeriveStepsOptions): StepDeriver {
  if (!(Number.isInteger(studCount) && studCount >= 1)) {
    throw new AppError('invalid_input', `Stud count must be a whole number of 1 or more, got ${studCount}.`, { field: 'studCount' });
  }
  if (!(Number.isFinite(options.targetLoadN) && options.targetLoadN > 0)) {
    throw new AppError('invalid_input', `Target load must be a positive number of N, got ${options.targetLoadN}.`, { field: 'targetLoadN' });
  }
  const threshold = (options.thresholdFraction ?? 0.02) * options.targetLoadN;
  const noise = (options.noiseFraction ?? 0.001) * options.targetLoadN;
  const settleRows = options.settleRows ?? 5;
  const base = new Float64Array(studCount);
  const baseLine = new Int32Array(studCount);
  let started = false;
  let rise: Peak | null = null;
  const found: Omit<DerivedStep, 'order' | 'pass'>[] = [];
  const passes: (number | null)[] = [];
  const warnings: string[] = [];
  let lastTogetherLine = -1;
  /** Line of the last step's reading: the next step's lines start after it, so ranges never overlap. */
  let lastEmittedLine = 0;
  const lastLoads = new Float64Array(studCount);
  let lastLine = 0;
  let lastTime: number | null = null;

  const resetBase = (s: Snapshot, keep: number) => {
    for (let k = 0; k < studCount; k++) {
      if (k === keep) continue;
      base[k] = s.loadsN[k]!;
      baseLine[k] = s.line;
    }
  };
  const emit = () => {
    if (!rise) return;
    const firstLine = Math.min(Math.max(rise.firstLine, lastEmittedLine + 1), rise.line);
    lastEmittedLine = rise.line;
    found.push({
      position: rise.position,
      firstLine,
      lastLine: rise.line,
      timeS: rise.timeS,
      loadsN: Array.from(rise.snapshot),
      riseN: rise.peakN - rise.baseN,
      appliedTorqueNm: rise.torque,
      appliedPressureBar: rise.pressure,
    });
    passes.push(rise.pass);
    rise = null;
  };
  const keepPeak = (r: Peak, s: Snapshot) => {
    for (let k = 0; k < studCount; k++) r.snapshot[k] = s.loadsN[k]!;
    r.line = s.line;
    r.timeS = s.timeS;
    r.torque = s.appliedTorqueNm ?? null;
    r.pressure = s.appliedPressureBar ?? null;
    r.pass = s.pass ?? null;
  };
  const idle = (s: Snapshot) => {
    const rising: number[] = [];
    for (let k = 0; k < studCount; k++) {
      const v = s.loadsN[k]!;
      if (v < base[k]!) {
        base[k] = v;
        baseLine[k] = s.line;
      }
      if (v - base[k]! > threshold) rising.push(k);
    }
    if (rising.length === 1) {
      const k = rising[0]!;
      const v = s.loadsN[k]!;
      rise = {
        position: k + 1,
        firstLine: baseLine[k]!,
        baseN: base[k]!,
        peakN: v,
        progressN: v,
        settle: 0,
        snapshot: new Float64Array(studCount),
        line: s.line,
        timeS: null,
        torque: null,
        pressure: null,
        pass: null,
      };
      keepPeak(rise, s);
    } else if (rising.length > 1) {
      if (lastTogetherLine < 0) {
        warnings.push(
          `Line ${s.line}: studs at positions ${rising.map((k) => k + 1).join(', ')} rose together; simultaneous tightening is not derived as a step.`,
        );
      }
      lastTogetherLine = s.line;
      resetBase(s, -1);
    } else lastTogetherLine = -1;
  };

  return {
    push(s) {
      if (s.loadsN.length !== studCount) {
        throw new AppError('invalid_input', `Line ${s.line}: expected ${studCount} stud loads, got ${s.loadsN.length}.`, { row: s.line });
      }
      for (let k = 0; k < studCount; k++) lastLoads[k] = s.loadsN[k]!;
      lastLine = s.line;
      lastTime = s.timeS;
      if (!started) {
        started = true;
        resetBase(s, -1);
        return;
      }
      const r: Peak | null = rise;
      if (!r) {
        idle(s);
        return;
      }
      const k = r.position - 1;
      const v = s.loadsN[k]!;
      if (v > r.progressN + noise) {
        r.progressN = v;
        r.settle = 0;
      } else r.settle++;
      if (v > r.peakN) {
        r.peakN = v;
        keepPeak(r, s);
      }
      let other = false;
      for (let j = 0; j < studCount; j++) {
        if (j === k) continue;
        const w = s.loadsN[j]!;
        if (w < base[j]!) {
          base[j] = w;
          baseLine[j] = s.line;
        }
        if (w - base[j]! > threshold) other = true;
      }
      if (other) {
        emit();
        for (let j = 0; j < studCount; j++) {
          const w = s.loadsN[j]!;
          if (j === k || w - base[j]! <= threshold) {
            base[j] = w;
            baseLine[j] = s.line;
          }
        }
        idle(s);
      } else if (r.settle >= settleRows || v < r.peakN - threshold) {
        emit();
        resetBase(s, -1);
      }
    },
    finish() {
      emit();
      const given = passes.some((p) => p !== null);
      const ruled = assignPasses(found.map((f) => f.position));
      let last = 1;
      const steps = found.map((f, i) => {
        let pass: number;
        if (given) {
          pass = passes[i] ?? last;
          last = pass;
        } else pass = ruled[i]!;
        return { order: i + 1, pass, ...f };
      });
      return { steps, warnings, last: lastLine > 0 ? { line: lastLine, timeS: lastTime, loadsN: Array.from(lastLoads) } : null };
    },
  };
}

/**
 * Derives the steps of a whole series at once; a thin wrapper over {@link createStepDeriver}.
 *
 * @example
 * // four studs, target 100 kN; stud 1 then stud 3 pulled to 30 kN
 * deriveSteps([{ line: 2, timeS: 0, loadsN: [0, 0, 0, 0] }, ...], 4, { targetLoadN: 100e3 })
 */
export function deriveSteps(snapshots: Iterable<Snapshot>, studCount: number, options: DeriveStepsOptions): DeriveStepsResult {
  const d = createStepDeriver(studCount, options);
  for (const s of snapshots) d.push(s);
  return d.finish();
}
