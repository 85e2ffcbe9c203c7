import { likelihoodRatioTest } from '../stats/likelihood-ratio-test';
import type { RandomInterceptModelResult } from '../stats/random-intercept-model';
import { randomInterceptModels } from '../stats/random-intercept-models';
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
  let total = 0;
  for (const g of groups) total += g.runs.length;
  const y = new Array<number>(total);
  const clusters = new Array<string | number>(total);
  const attempts = new Array<number | null>(total);
  // One 0/1 column per group after the first.
  const groupColumns = groups.slice(1).map(() => new Array<number>(total).fill(0));
  let at = 0;
  groups.forEach((g, gi) => {
    for (const r of g.runs) {
      y[at] = r.lnCv;
      clusters[at] = r.operator;
      attempts[at] = r.attempt;
      if (gi > 0) groupColumns[gi - 1]![at] = 1;
      at += 1;
    }
  });
  const attemptKnown = attempts.every((a): a is number => typeof a === 'number') && new Set(attempts).size > 1;
  const attemptColumns = attemptKnown ? [attempts as number[]] : [];
  const full = [...groupColumns, ...attemptColumns];
  const all = full.map((_, j) => j);
  // One prepared design for the three fits (the same numbers as three separate randomInterceptModel calls).
  const [fullMl, reducedMl, reml] = randomInterceptModels(full, y, clusters, [
    { predictors: all, method: 'ML' },
    { predictors: attemptKnown ? [groupColumns.length] : [], method: 'ML' },
    { predictors: all, method: 'REML' },
  ]) as [RandomInterceptModelResult, RandomInterceptModelResult, RandomInterceptModelResult];
  const lrt = likelihoodRatioTest(fullMl.logLikelihood, reducedMl.logLikelihood, groupColumns.length);
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
    runs: total,
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
