import { median } from 'simple-statistics';
import { oneWayAnova, type OneWayAnovaResult } from '../one-way-anova';
import { mean } from '../mean';

/**
 * The core of Levene-type tests: one-way ANOVA on zᵢⱼ = |yᵢⱼ − cᵢ| where cᵢ is the group mean
 * (Levene 1960) or the group median (Brown & Forsythe 1974).
 *
 * References: NIST/SEMATECH e-Handbook §1.3.5.10 (Levene test).
 * @throws {StatsError} as `oneWayAnova` (callers validate first with their own name).
 * @example
 * absoluteDeviationAnova([[1, 2, 3], [2, 4, 6]], 'mean').statistic; // 0.8 (hand: SSB 2/3, SSW 10/3)
 */
export function absoluteDeviationAnova(
  groups: readonly (readonly number[])[],
  centre: 'mean' | 'median',
): OneWayAnovaResult {
  const deviations = groups.map((g) => {
    const c = centre === 'mean' ? mean(g) : median(g as number[]);
    return g.map((v) => Math.abs(v - c));
  });
  return oneWayAnova(deviations);
}
