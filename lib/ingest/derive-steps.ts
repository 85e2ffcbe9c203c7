/**
 * Finding the steps in a time series of stud loads that has no step marker. Our own rule, stated
 * here so the UI can explain it next to the derived steps it shows for confirmation:
 *
 * 1. Each stud keeps a base: the lowest load it has had since the last step ended.
 * 2. A rise starts when one or more studs are more than the threshold (default 2 % of the target
 *    load) above their base. Studs that cross on the same row, or on the row after the first,
 *    rise together: one step that covers several positions (a tensioner tool set pulling every
 *    stud, or every other one, at once).
 * 3. While the studs climb, each keeps its peak (the applied load). The rise ends when none has
 *    climbed by more than the noise band (default 0.1 % of target) for `settleRows` rows (default
 *    5), when another stud starts rising, or at the end of the data; or, when a stud of the step
 *    falls more than the threshold below its peak, the tool was released: the step then follows
 *    the fall until no stud of the step has dropped by more than the noise band for `settleRows`
 *    rows (or another stud rises, or the data end).
 * 4. The step's reading is the snapshot of every stud after release (the residual loads), or,
 *    where nothing was released (a torque wrench), at the row where the rising studs peaked. A
 *    released step, and every step of several studs, keeps per stud the applied (peak) and the
 *    residual load (`covers`). Its row range runs from the earliest base row of its studs (or the
 *    row after the previous step's reading, whichever is later, so ranges never overlap) to the
 *    reading's row.
 * 5. Passes: when the file has no pass numbers, a new pass starts whenever a stud already
 *    tightened in the current pass is tightened again ({@link assignPasses}).
 *
 * Limits: a re-tightening that adds less than the threshold (a final check pass where nuts barely
 * turn) is not seen; a pause mid-pull longer than `settleRows` splits one pull into two steps; a
 * tool set whose studs cross the threshold more than a row apart is read as separate steps.
 * Files with a step column avoid all three.
 *
 * Memory is O(studCount) whatever the number of rows, so it runs inside a streaming import.
 */
import { AppError } from '@/lib/http/errors';
import type { StepCover } from '@/lib/record/run-types';

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
  /** Position of the stud whose load rose (the lowest, when several rose together). */
  position: number;
  /** Line of the rising studs' earliest base (where the rise began). */
  firstLine: number;
  /** Line of the reading (the residual after release, else the peak). */
  lastLine: number;
  timeS: number | null;
  /** Snapshot of every stud at `lastLine`, in N. */
  loadsN: number[];
  /** How much the rising stud gained from its base to its peak, in N (the most, when several rose). */
  riseN: number;
  appliedTorqueNm: number | null;
  appliedPressureBar: number | null;
  /** Every stud of a step that covered several, or was released, with its applied (peak) and residual load; null otherwise. */
  covers?: StepCover[] | null;
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
 * Pass numbers for a sequence of steps, each the set of positions it tightened: pass 1 first, and
 * a new pass whenever a position already tightened in the current pass comes again.
 * `[[1,3],[2,4],[1,3]]` → `[1,1,2]`.
 */
export function assignPassesToGroups(groups: readonly (readonly number[])[]): number[] {
  const seen = new Set<number>();
  let pass = 1;
  return groups.map((group) => {
    if (group.some((p) => seen.has(p))) {
      pass++;
      seen.clear();
    }
    for (const p of group) seen.add(p);
    return pass;
  });
}

/**
 * Pass numbers for a sequence of tightened positions: pass 1 first, and a new pass whenever a
 * position already tightened in the current pass comes again. `[1,3,2,4,1,3,2,4]` → `[1,1,1,1,2,2,2,2]`.
 */
export const assignPasses = (positions: readonly number[]): number[] => assignPassesToGroups(positions.map((p) => [p]));

/** Studs that cross the threshold up to this many rows after a rise began join it (one tool set). */
const JOIN_ROWS = 1;

interface Rise {
  /** 0-based indexes of the studs of the step, ascending. */
  members: number[];
  startLine: number;
  firstLine: number;
  baseN: number[];
  peakN: number[];
  /** Highest (rising) or lowest (releasing) value counted as progress, per member. */
  markN: number[];
  settle: number;
  released: boolean;
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
  let rise: Rise | null = null;
  const found: Omit<DerivedStep, 'order' | 'pass'>[] = [];
  const groups: number[][] = [];
  const passes: (number | null)[] = [];
  /** Line of the last step's reading: the next step's lines start after it, so ranges never overlap. */
  let lastEmittedLine = 0;
  const lastLoads = new Float64Array(studCount);
  let lastLine = 0;
  let lastTime: number | null = null;

  const resetBase = (s: Snapshot) => {
    for (let k = 0; k < studCount; k++) {
      base[k] = s.loadsN[k]!;
      baseLine[k] = s.line;
    }
  };
  const keep = (r: Rise, s: Snapshot, withTools: boolean) => {
    for (let k = 0; k < studCount; k++) r.snapshot[k] = s.loadsN[k]!;
    r.line = s.line;
    r.timeS = s.timeS;
    if (withTools) {
      r.torque = s.appliedTorqueNm ?? null;
      r.pressure = s.appliedPressureBar ?? null;
      r.pass = s.pass ?? null;
    }
  };
  const emit = () => {
    if (!rise) return;
    const r = rise;
    const firstLine = Math.min(Math.max(r.firstLine, lastEmittedLine + 1), r.line);
    lastEmittedLine = r.line;
    const withCovers = r.released || r.members.length > 1;
    found.push({
      position: r.members[0]! + 1,
      firstLine,
      lastLine: r.line,
      timeS: r.timeS,
      loadsN: Array.from(r.snapshot),
      riseN: Math.max(...r.members.map((k, j) => r.peakN[j]! - r.baseN[j]!)),
      appliedTorqueNm: r.torque,
      appliedPressureBar: r.pressure,
      covers: withCovers ? r.members.map((k, j) => ({ position: k + 1, appliedN: r.peakN[j]!, residualN: r.snapshot[k]! })) : null,
    });
    groups.push(r.members.map((k) => k + 1));
    passes.push(r.pass);
    rise = null;
  };
  const join = (r: Rise, k: number, v: number) => {
    const at = r.members.findIndex((m) => m > k);
    const j = at < 0 ? r.members.length : at;
    r.members.splice(j, 0, k);
    r.baseN.splice(j, 0, base[k]!);
    r.peakN.splice(j, 0, v);
    r.markN.splice(j, 0, v);
    r.firstLine = Math.min(r.firstLine, baseLine[k]!);
  };
  /** Lowers the bases of the studs outside the step; true when one of them rose past the threshold. */
  const othersRising = (r: Rise, s: Snapshot): number[] => {
    const rising: number[] = [];
    for (let k = 0; k < studCount; k++) {
      if (r.members.includes(k)) continue;
      const w = s.loadsN[k]!;
      if (w < base[k]!) {
        base[k] = w;
        baseLine[k] = s.line;
      }
      if (w - base[k]! > threshold) rising.push(k);
    }
    return rising;
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
    if (rising.length === 0) return;
    const r: Rise = { members: [], startLine: s.line, firstLine: s.line, baseN: [], peakN: [], markN: [], settle: 0, released: false, snapshot: new Float64Array(studCount), line: s.line, timeS: null, torque: null, pressure: null, pass: null };
    for (const k of rising) join(r, k, s.loadsN[k]!);
    keep(r, s, true);
    rise = r;
  };
  /** Another stud rose: the step ends here, the bases start again from this row and a new rise may begin. */
  const endOnOther = (r: Rise, s: Snapshot) => {
    emit();
    for (let j = 0; j < studCount; j++) {
      const w = s.loadsN[j]!;
      if (r.members.includes(j) || w - base[j]! <= threshold) {
        base[j] = w;
        baseLine[j] = s.line;
      }
    }
    idle(s);
  };
  const climb = (r: Rise, s: Snapshot) => {
    const others = othersRising(r, s);
    if (others.length > 0 && s.line <= r.startLine + JOIN_ROWS) for (const k of others) join(r, k, s.loadsN[k]!);
    else if (others.length > 0) return endOnOther(r, s);
    let progress = false;
    let peaked = false;
    let fell = false;
    r.members.forEach((k, j) => {
      const v = s.loadsN[k]!;
      if (v > r.markN[j]! + noise) {
        r.markN[j] = v;
        progress = true;
      }
      if (v > r.peakN[j]!) {
        r.peakN[j] = v;
        peaked = true;
      }
      if (v < r.peakN[j]! - threshold) fell = true;
    });
    if (peaked) keep(r, s, true);
    r.settle = progress ? 0 : r.settle + 1;
    if (fell) {
      r.released = true;
      r.settle = 0;
      r.markN = r.members.map((k) => s.loadsN[k]!);
      keep(r, s, false);
    } else if (r.settle >= settleRows) {
      emit();
      resetBase(s);
    }
  };
  const release = (r: Rise, s: Snapshot) => {
    if (othersRising(r, s).length > 0) return endOnOther(r, s);
    let fell = false;
    r.members.forEach((k, j) => {
      const v = s.loadsN[k]!;
      if (v < r.markN[j]! - noise) {
        r.markN[j] = v;
        fell = true;
      }
    });
    if (fell) {
      r.settle = 0;
      keep(r, s, false);
    } else if (++r.settle >= settleRows) {
      emit();
      resetBase(s);
    }
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
        resetBase(s);
        return;
      }
      const r: Rise | null = rise;
      if (!r) idle(s);
      else if (r.released) release(r, s);
      else climb(r, s);
    },
    finish() {
      emit();
      const given = passes.some((p) => p !== null);
      const ruled = assignPassesToGroups(groups);
      let last = 1;
      const steps = found.map((f, i) => {
        let pass: number;
        if (given) {
          pass = passes[i] ?? last;
          last = pass;
        } else pass = ruled[i]!;
        return { order: i + 1, pass, ...f };
      });
      return { steps, warnings: [], last: lastLine > 0 ? { line: lastLine, timeS: lastTime, loadsN: Array.from(lastLoads) } : null };
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
