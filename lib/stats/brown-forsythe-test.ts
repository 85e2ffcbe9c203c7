import { leveneTypeTest } from './internal/absolute-deviation-anova';
import type { LeveneTypeResult } from './levene-test';

/**
 * Brown–Forsythe test for equal variances (Levene's test centred on the group medians): more
 * robust than the mean-centred form when loads are skewed or carry an outlier. This is the
 * variant the NIST/SEMATECH e-Handbook's Levene example computes (GEAR data, W ≈ 1.7059).
 *
 * Algorithm: absolute deviations from each group's median (simple-statistics `median`), then
 * `oneWayAnova`; p from `fUpperTail`.
 *
 * References: Brown & Forsythe, JASA 69 (1974) 364–367; NIST/SEMATECH e-Handbook §1.3.5.10;
 * scipy.stats.levene(center='median') (test reference).
 *
 * @throws {StatsError} `brownForsytheTest requires at least two groups`, too few values per group,
 *   non-finite values, `brownForsytheTest requires some variation in the absolute deviations`.
 * @example
 * brownForsytheTest(gearDiametersByBatch).statistic; // 1.7059176930008935 (GEAR.DAT; scipy levene center='median')
 */
export function brownForsytheTest(groups: readonly (readonly number[])[]): LeveneTypeResult {
  return leveneTypeTest('brownForsytheTest', groups, 'median');
}
