import { leveneTypeTest } from './internal/absolute-deviation-anova';

/** Result of {@link leveneTest} and (with kind 'brownForsytheTest') of `brownForsytheTest`. */
export interface LeveneTypeResult {
  kind: 'leveneTest' | 'brownForsytheTest';
  /** W, the one-way ANOVA F of the absolute deviations. */
  statistic: number;
  dfBetween: number;
  dfWithin: number;
  pValue: number;
  groupCount: number;
  n: number;
}

/**
 * Levene's test for equal variances, mean-centred (Levene 1960): does the scatter differ between
 * groups? W is the one-way ANOVA F statistic of |yᵢⱼ − ȳᵢ|.
 *
 * Algorithm: absolute deviations from each group's refined mean, then `oneWayAnova`; p from
 * `fUpperTail`. The median-centred variant (which the e-Handbook's worked example uses) is
 * `brownForsytheTest`.
 *
 * References: Levene, in Contributions to Probability and Statistics (1960) 278–292;
 * NIST/SEMATECH e-Handbook §1.3.5.10; scipy.stats.levene(center='mean') (test reference).
 *
 * @throws {StatsError} `leveneTest requires at least two groups`, `leveneTest requires at least two values of group 1 (got 1)`,
 *   non-finite values, `leveneTest requires some variation in the absolute deviations`.
 * @example
 * leveneTest([[1, 2, 3], [2, 4, 6]]).statistic; // 0.8 (scipy.stats.levene([1,2,3],[2,4,6], center='mean') = 0.7999999999999997)
 */
export function leveneTest(groups: readonly (readonly number[])[]): LeveneTypeResult {
  return leveneTypeTest('leveneTest', groups, 'mean');
}
