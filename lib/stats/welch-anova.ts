import { sum } from 'simple-statistics';
import { StatsError } from './stats-error';
import { assertGroups } from './internal/assert-groups';
import { fUpperTail } from './f-upper-tail';
import { mean } from './mean';
import { sampleVariance } from './sample-variance';

/** Result of {@link welchAnova}. */
export interface WelchAnovaResult {
  kind: 'welchAnova';
  groupCount: number;
  n: number;
  statistic: number;
  dfBetween: number;
  /** Fractional (Welch) denominator degrees of freedom. */
  dfWithin: number;
  pValue: number;
}

/**
 * Welch's one-way ANOVA: compares group means without assuming equal variances (useful when one
 * tightening method scatters much more than another).
 *
 * Algorithm (Welch 1951): wᵢ = nᵢ/sᵢ², ȳw = Σwᵢȳᵢ/Σwᵢ, A = Σwᵢ(ȳᵢ − ȳw)²/(k − 1),
 * h = Σ(1 − wᵢ/Σw)²/(nᵢ − 1), F = A/[1 + 2(k − 2)h/(k² − 1)], df = (k − 1, (k² − 1)/(3h)).
 * Means and variances are the refined / corrected two-pass ones; p from `fUpperTail`.
 *
 * References: Welch, "On the comparison of several mean values: an alternative approach",
 * Biometrika 38 (1951) 330–336; scipy.stats.f_oneway(equal_var=False) (same formula, used as the
 * test reference).
 *
 * @throws {StatsError} `welchAnova requires at least two groups`,
 *   `welchAnova requires at least two values of group 1 (got 1)`, non-finite values,
 *   `welchAnova requires some variation within every group (group 2 is constant)`.
 * @example
 * welchAnova([[1, 2, 3, 4], [2, 4, 6, 8, 10]]).statistic; // 5.06896551724138 (scipy.stats.f_oneway(..., equal_var=False) = 5.06896551724138)
 */
export function welchAnova(groups: readonly (readonly number[])[]): WelchAnovaResult {
  assertGroups('welchAnova', groups, 2, 2);
  const k = groups.length;
  const means = groups.map((g) => mean(g));
  const variances = groups.map((g) => sampleVariance(g));
  variances.forEach((v, i) => {
    if (v === 0) throw new StatsError(`welchAnova requires some variation within every group (group ${i + 1} is constant)`);
  });
  const weights = groups.map((g, i) => g.length / variances[i]!);
  const wSum = sum(weights);
  const weightedMean = sum(weights.map((w, i) => w * means[i]!)) / wSum;
  const a = sum(weights.map((w, i) => w * (means[i]! - weightedMean) ** 2)) / (k - 1);
  const h = sum(weights.map((w, i) => (1 - w / wSum) ** 2 / (groups[i]!.length - 1)));
  const statistic = a / (1 + (2 * (k - 2) * h) / (k * k - 1));
  const dfWithin = (k * k - 1) / (3 * h);
  return {
    kind: 'welchAnova',
    groupCount: k,
    n: groups.reduce((acc, g) => acc + g.length, 0),
    statistic,
    dfBetween: k - 1,
    dfWithin,
    pValue: fUpperTail(statistic, k - 1, dfWithin),
  };
}
