import { sum } from 'simple-statistics';
import { StatsError } from './stats-error';
import { assertGroups } from './internal/assert-groups';
import { chiSquareUpperTail } from './chi-square-upper-tail';
import { sampleVariance } from './sample-variance';

/** Result of {@link bartlettTest}. */
export interface BartlettTestResult {
  kind: 'bartlettTest';
  /** Bartlett's T, approximately chi-square with k − 1 df under equal variances. */
  statistic: number;
  df: number;
  pValue: number;
  groupCount: number;
  n: number;
}

/**
 * Bartlett's test for equal variances: more powerful than Levene's when the loads are normal,
 * but sensitive to non-normality.
 *
 * Algorithm: T = [(N − k) ln sp² − Σ(nᵢ − 1) ln sᵢ²] / [1 + (Σ 1/(nᵢ − 1) − 1/(N − k))/(3(k − 1))],
 * sp² the pooled variance; corrected two-pass variances; p from `chiSquareUpperTail`.
 *
 * References: Bartlett, Proc. R. Soc. A 160 (1937) 268–282; NIST/SEMATECH e-Handbook §1.3.5.7;
 * scipy.stats.bartlett (test reference).
 *
 * @throws {StatsError} `bartlettTest requires at least two groups`, too few values per group,
 *   non-finite values, `bartlettTest requires some variation within every group (group 2 is constant)`.
 * @example
 * bartlettTest(gearDiametersByBatch).statistic; // 20.785873428064864 (GEAR.DAT; scipy.stats.bartlett)
 */
export function bartlettTest(groups: readonly (readonly number[])[]): BartlettTestResult {
  assertGroups('bartlettTest', groups, 2, 2);
  const k = groups.length;
  const n = groups.reduce((acc, g) => acc + g.length, 0);
  const variances = groups.map((g) => sampleVariance(g));
  variances.forEach((v, i) => {
    if (v === 0) throw new StatsError(`bartlettTest requires some variation within every group (group ${i + 1} is constant)`);
  });
  const dof = groups.map((g) => g.length - 1);
  const pooled = sum(variances.map((v, i) => dof[i]! * v)) / (n - k);
  const numerator = (n - k) * Math.log(pooled) - sum(variances.map((v, i) => dof[i]! * Math.log(v)));
  const denominator = 1 + (sum(dof.map((d) => 1 / d)) - 1 / (n - k)) / (3 * (k - 1));
  const statistic = numerator / denominator;
  return { kind: 'bartlettTest', statistic, df: k - 1, pValue: chiSquareUpperTail(statistic, k - 1), groupCount: k, n };
}
