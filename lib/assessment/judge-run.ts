import { gradePropertiesForThread } from '../calc/grades';
import { threadGeometry, type ThreadSpec } from '../calc/thread';
import { formatInputValue, formatPercent } from '../calc/units';
import { coefficientOfVariation } from '../stats/coefficient-of-variation';
import { largestDeviationFromTarget } from '../stats/largest-deviation-from-target';
import { shareWithinBand } from '../stats/share-within-band';
import type { MethodPass } from '@/models/method';
import type { AssessmentCriteria } from './criteria';
import { gradeIdOf } from '../joints/joint-properties';

/**
 * Judges one run against a cohort's acceptance criteria. Pure: the caller loads the run, its
 * method and joint. Every result carries the measured figure, the limit and a sentence in plain
 * words (the "reading").
 */

export type CriterionKey = 'band' | 'cv' | 'pattern' | 'yield';

export interface CriterionResult {
  key: CriterionKey;
  label: string;
  met: boolean;
  /** The figure measured on the run (unit in `unit`); null when it could not be measured. */
  measured: number | null;
  /** The limit it was held against, in the same unit. */
  limit: number;
  unit: '%' | 'passes';
  sentence: string;
  /** Extra figures the result sheets and mails show. */
  detail?: Record<string, number | string>;
}

export interface JudgeRunStep {
  order: number;
  pass: number;
  position: number;
  /** Every stud's load after this step (N), when known; used for the peak load. */
  loadsN?: readonly number[];
}

export interface JudgeRunInput {
  targetLoadN: number;
  /** Final load of every stud (N), index 0 = position 1. */
  finalLoadsN: readonly number[];
  steps: readonly JudgeRunStep[];
  method: { passes: readonly MethodPass[]; checkPasses: number };
  joint: { studCount: number; thread: ThreadSpec; studGrade: string };
  criteria: AssessmentCriteria;
}

export interface Judgement {
  results: CriterionResult[];
  allMet: boolean;
}

const pct = (value: number) => formatPercent(value, { sig: 3 });
/** A limit as the instructor typed it: 70, 2.5, 10 (no padding zeros). */
const plain = (value: number) => formatInputValue(value, 6);

function judgeBand(input: JudgeRunInput): CriterionResult {
  const { finalLoadsN, targetLoadN, criteria } = input;
  const band = shareWithinBand(finalLoadsN, targetLoadN, criteria.bandPercent);
  const far = largestDeviationFromTarget(finalLoadsN, targetLoadN);
  const met = band.count === band.n;
  const direction = far.deviation < 0 ? 'below' : 'above';
  const sentence = met
    ? `All ${band.n} studs ended within ±${plain(criteria.bandPercent)} % of the target load; the farthest, position ${far.index + 1}, was ${pct(Math.abs(far.percent))} ${direction} it.`
    : `${band.count} of ${band.n} studs ended within ±${plain(criteria.bandPercent)} % of the target load; the farthest, position ${far.index + 1}, was ${pct(Math.abs(far.percent))} ${direction} it.`;
  return {
    key: 'band',
    label: `Every final load within ±${plain(criteria.bandPercent)} % of target`,
    met,
    measured: Math.abs(far.percent),
    limit: criteria.bandPercent,
    unit: '%',
    sentence,
    detail: { inBand: band.count, studs: band.n, shareInBandPercent: band.share * 100, farthestPosition: far.index + 1, farthestDeviationPercent: far.percent },
  };
}

function judgeCv(input: JudgeRunInput): CriterionResult {
  const cvPercent = coefficientOfVariation(input.finalLoadsN) * 100;
  const limit = input.criteria.maxCvPercent;
  const met = cvPercent <= limit;
  return {
    key: 'cv',
    label: `CV of the final loads at most ${plain(limit)} %`,
    met,
    measured: cvPercent,
    limit,
    unit: '%',
    sentence: met
      ? `The CV of the final loads was ${pct(cvPercent)}, within the ${plain(limit)} % allowed: an even joint.`
      : `The CV of the final loads was ${pct(cvPercent)}, more than the ${plain(limit)} % allowed: the loads are too uneven.`,
  };
}

/** True when `order` is one clockwise round of 1..n starting anywhere (a circular pass). */
function isCircularRound(order: readonly number[], n: number): boolean {
  if (order.length !== n || n === 0) return false;
  const start = order[0]!;
  return order.every((position, i) => position === ((start - 1 + i) % n) + 1);
}

function judgePattern(input: JudgeRunInput): CriterionResult {
  const { steps, method, joint } = input;
  const n = joint.studCount;
  const prescribed = method.passes.map((pass) => pass.orderByStudCount[String(n)]);
  const required = method.passes.length + method.checkPasses;
  const base = { key: 'pattern' as const, label: 'The prescribed pattern followed', limit: required, unit: 'passes' as const };
  if (prescribed.some((order) => !order)) {
    return { ...base, met: false, measured: null, sentence: `The method has no stud order for ${n} studs, so the pattern cannot be checked; add one to the method.` };
  }
  const byPass = new Map<number, number[]>();
  for (const step of [...steps].sort((a, b) => a.order - b.order)) {
    const list = byPass.get(step.pass) ?? [];
    list.push(step.position);
    byPass.set(step.pass, list);
  }
  const recordedPasses = [...byPass.keys()].sort((a, b) => a - b);
  let followed = 0;
  let problem: string | null = null;
  for (let i = 0; i < Math.max(required, recordedPasses.length); i += 1) {
    const passNumber = i + 1;
    const recorded = byPass.get(passNumber);
    const isCheck = i >= method.passes.length;
    if (!recorded) {
      if (i < required) problem ??= `Pass ${passNumber} ${isCheck ? '(a circular check pass) ' : ''}was not recorded.`;
      continue;
    }
    if (!isCheck) {
      const expected = prescribed[i]!;
      const at = recorded.findIndex((position, k) => position !== expected[k]);
      const mismatch = at >= 0 || recorded.length !== expected.length;
      if (mismatch) {
        const k = at >= 0 ? at : Math.min(recorded.length, expected.length);
        const got = recorded[k];
        const want = expected[k];
        problem ??=
          want === undefined
            ? `In pass ${passNumber} more studs were tightened than the method prescribes (${recorded.length} instead of ${expected.length}).`
            : got === undefined
              ? `Pass ${passNumber} stopped after ${recorded.length} of ${expected.length} studs.`
              : `In pass ${passNumber}, step ${k + 1} tightened position ${got} where the method prescribes position ${want}.`;
      } else followed += 1;
    } else if (isCircularRound(recorded, n)) {
      followed += 1;
    } else {
      problem ??= `Pass ${passNumber} should be a circular check pass (each stud once, clockwise), but the order was ${recorded.join('-')}.`;
    }
  }
  const met = problem === null && followed >= required;
  return {
    ...base,
    met,
    measured: followed,
    sentence: met
      ? `${required === 1 ? 'The one pass' : `All ${required} passes`} followed the method's order${method.checkPasses ? `, check ${method.checkPasses === 1 ? 'pass' : 'passes'} circular` : ''}.`
      : `${problem ?? 'The pattern was not followed.'} ${followed} of ${required} ${required === 1 ? 'pass' : 'passes'} followed the method's order.`,
  };
}

function judgeYield(input: JudgeRunInput): CriterionResult {
  const { joint, criteria } = input;
  const limit = criteria.maxYieldPercent;
  const base = { key: 'yield' as const, label: `No stud above ${plain(limit)} % of its minimum yield load`, limit, unit: '%' as const };
  const gradeId = gradeIdOf(joint.studGrade);
  if (!gradeId) {
    return { ...base, met: false, measured: null, sentence: `The stud grade "${joint.studGrade}" is not in the grade table, so the yield check cannot be made; correct the joint's stud grade.` };
  }
  const yieldMpa = gradePropertiesForThread(gradeId, joint.thread).yieldMpa;
  const areaMm2 = threadGeometry(joint.thread).tensileStressAreaMm2;
  const yieldLoadN = yieldMpa * areaMm2;
  let peak = Math.max(...input.finalLoadsN);
  let peakPosition = input.finalLoadsN.indexOf(peak) + 1;
  for (const step of input.steps) {
    step.loadsN?.forEach((load, index) => {
      if (load > peak) {
        peak = load;
        peakPosition = index + 1;
      }
    });
  }
  const measured = (peak / yieldLoadN) * 100;
  const met = measured <= limit;
  return {
    ...base,
    met,
    measured,
    sentence: met
      ? `The highest stud load, at position ${peakPosition}, reached ${pct(measured)} of the minimum yield load, within the ${plain(limit)} % limit.`
      : `The highest stud load, at position ${peakPosition}, reached ${pct(measured)} of the minimum yield load, above the ${plain(limit)} % limit: that stud was over-loaded.`,
    detail: { yieldLoadN, peakLoadN: peak, peakPosition },
  };
}

/**
 * Judges a run: band, CV, pattern (when the criteria require it) and yield.
 * @example judgeRun({ targetLoadN: 100, finalLoadsN: [95, 105, 100, 100], ... }).results[0].met // true for ±10 %
 */
export function judgeRun(input: JudgeRunInput): Judgement {
  if (input.finalLoadsN.length !== input.joint.studCount) {
    throw new Error(`judgeRun requires one final load per stud (${input.joint.studCount}), got ${input.finalLoadsN.length}`);
  }
  const results = [judgeBand(input), judgeCv(input), ...(input.criteria.requirePattern ? [judgePattern(input)] : []), judgeYield(input)];
  return { results, allMet: results.every((r) => r.met) };
}
