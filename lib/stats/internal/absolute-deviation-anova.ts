import { median } from 'simple-statistics';
import { fUpperTail } from '../f-upper-tail';
import type { LeveneTypeResult } from '../levene-test';
import { mean } from '../mean';
import { oneWayAnova, type OneWayAnovaResult } from '../one-way-anova';
import { StatsError } from '../stats-error';
import { assertGroups } from './assert-groups';

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

/**
 * Levene (`centre` 'mean') and Brown–Forsythe ('median') share everything but the centre: validate
 * under the caller's name, run `absoluteDeviationAnova`, and take p from `fUpperTail`.
 * @throws {StatsError} `<name> requires at least two groups`, too few values, non-finite values,
 *   `<name> requires some variation in the absolute deviations`.
 */
export function leveneTypeTest(
  name: 'leveneTest' | 'brownForsytheTest',
  groups: readonly (readonly number[])[],
  centre: 'mean' | 'median',
): LeveneTypeResult {
  assertGroups(name, groups, 2, 2);
  let a: OneWayAnovaResult;
  try {
    a = absoluteDeviationAnova(groups, centre);
  } catch (e) {
    if (e instanceof StatsError) throw new StatsError(`${name} requires some variation in the absolute deviations`);
    throw e;
  }
  return {
    kind: name,
    statistic: a.statistic,
    dfBetween: a.dfBetween,
    dfWithin: a.dfWithin,
    pValue: fUpperTail(a.statistic, a.dfBetween, a.dfWithin),
    groupCount: a.groupCount,
    n: a.n,
  };
}
