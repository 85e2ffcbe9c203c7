import { likelihoodRatioTest } from '../stats/likelihood-ratio-test';
import { randomInterceptModel } from '../stats/random-intercept-model';
import type { TraineeBlocks } from './compare-types';
import type { RawTest } from './compare-run-tests';
import { TEST_QUESTIONS } from './compare-types';

/** Runs of one group with their ln CV, operator and attempt. */
export interface BlockedGroup {
  key: string;
  label: string;
  runs: { lnCv: number; operator: string | number; attempt: number | null }[];
}

/** The normal 97.5 % quantile, for Wald intervals (common practice). */
const Z_975 = 1.959963984540054;

/**
 * Trainees as blocks: ln run CV ~ group (+ attempt number when every run has one and it varies),
 * with a random intercept per operator (`randomInterceptModel`). The group effect is tested by a
 * likelihood-ratio test of the ML fits with and without the group columns; the estimates shown
 * (each group's run CV relative to the first, Wald 95 % interval) come from the REML fit.
 */
export function traineeBlocks(groups: readonly BlockedGroup[]): { blocks: TraineeBlocks; test: RawTest } {
  const runs = groups.flatMap((g, gi) => g.runs.map((r) => ({ ...r, gi })));
  const y = runs.map((r) => r.lnCv);
  const clusters = runs.map((r) => r.operator);
  const groupColumns = groups.slice(1).map((_, j) => runs.map((r) => (r.gi === j + 1 ? 1 : 0)));
  const attempts = runs.map((r) => r.attempt);
  const attemptKnown = attempts.every((a): a is number => typeof a === 'number') && new Set(attempts).size > 1;
  const attemptColumns = attemptKnown ? [attempts as number[]] : [];
  const full = [...groupColumns, ...attemptColumns];
  const fullMl = randomInterceptModel(full, y, clusters, { method: 'ML' });
  const reducedMl = randomInterceptModel(attemptColumns, y, clusters, { method: 'ML' });
  const lrt = likelihoodRatioTest(fullMl.logLikelihood, reducedMl.logLikelihood, groupColumns.length);
  const reml = randomInterceptModel(full, y, clusters, { method: 'REML' });
  const wald = (index: number) => {
    const b = reml.coefficients[index]!;
    const se = reml.standardErrors[index]!;
    return { value: Math.exp(b), lower: Math.exp(b - Z_975 * se), upper: Math.exp(b + Z_975 * se) };
  };
  const estimates = groups.map((g, gi) => {
    if (gi === 0) return { key: g.key, label: g.label, ratio: 1, lower: 1, upper: 1 };
    const w = wald(gi);
    return { key: g.key, label: g.label, ratio: w.value, lower: w.lower, upper: w.upper };
  });
  const furthest = estimates.slice(1).reduce((best, e) => (Math.abs(Math.log(e.ratio)) > Math.abs(Math.log(best.ratio)) ? e : best), estimates[1]!);
  const blocks: TraineeBlocks = {
    estimates,
    perAttempt: attemptKnown ? wald(groups.length) : null,
    operators: fullMl.numberOfClusters,
    runs: runs.length,
    operatorSd: Math.sqrt(reml.clusterVariance),
    residualSd: Math.sqrt(reml.residualVariance),
  };
  const test: RawTest = {
    id: 'trainee-blocks',
    question: TEST_QUESTIONS['trainee-blocks'],
    name: `Likelihood-ratio test, mixed model with operators as blocks${attemptKnown ? ' and attempt number' : ''}`,
    statistic: lrt.statistic,
    pValue: lrt.pValue,
    df: String(lrt.df),
    measure: 'run CV',
    effect: { label: `Run CV, ${furthest.label} ÷ ${groups[0]!.label}, operators held fixed`, estimate: furthest.ratio, lower: furthest.lower, upper: furthest.upper, scale: 'ratio' },
  };
  return { blocks, test };
}
