import { jStat } from 'jstat';
import { StatsError } from './stats-error';
import { assertNumber } from './internal/assert-number';
import { brentRoot } from './internal/brent-root';
import { studentTQuantile } from './student-t-quantile';

/** Result of {@link runsPerGroupForCvRatio}. */
export interface RunsPerGroupResult {
  kind: 'runsPerGroupForCvRatio';
  /** Fractional runs per group at which the power equals the target exactly. */
  exact: number;
  /** Runs to plan per group: ⌈exact⌉, at least 2. */
  perGroup: number;
  /** Standardised effect d = |ln ratio| / sdLogCv. */
  effectSize: number;
  /** Power with `perGroup` runs in each group. */
  achievedPower: number;
}

/**
 * Planner: how many runs per group a two-sided two-sample t-test on ln(run CV) needs to tell apart
 * groups whose CVs differ by `ratio`, given the SD of ln CV between runs (from the lab's own runs).
 *
 * Algorithm: d = |ln ratio|/sdLogCv; with n runs per group, ν = 2n − 2, δ = d·√(n/2),
 * c = t₁₋α/₂,ν and power(n) = P(T′ > c) + P(T′ < −c) for T′ noncentral t(ν, δ) (jstat's
 * `noncentralt.cdf`, the series of Lenth's AS 243); n solved from power(n) = target by Brent's root
 * finder on the real line (n > 1), then rounded up.
 *
 * References: Cohen, Statistical Power Analysis for the Behavioral Sciences, 2nd ed. (1988) ch. 2;
 * Lenth, "Algorithm AS 243: cumulative distribution function of the non-central t distribution",
 * Applied Statistics 38 (1989) 185–189; test reference statsmodels TTestIndPower().solve_power(
 * effect_size=d, alpha, power, ratio=1, alternative='two-sided') in scripts/generate-multiple-comparison-fixtures.py.
 *
 * @throws {StatsError} `runsPerGroupForCvRatio requires a positive ratio (got 0)`, `... requires a ratio other than 1`,
 *   `... requires a positive sdLogCv (got 0)`, `... requires a probability in (0, 1) as alpha (got 0)`,
 *   `runsPerGroupForCvRatio requires a power above alpha (got 0.04 for 0.05)`.
 * @example
 * runsPerGroupForCvRatio({ ratio: 1.5, sdLogCv: 0.4 }).perGroup; // 17 (exact 16.2959…; statsmodels TTestIndPower().solve_power(effect_size=ln(1.5)/0.4, alpha=0.05, power=0.8) = 16.29592966)
 */
export function runsPerGroupForCvRatio(input: { ratio: number; sdLogCv: number; alpha?: number; power?: number }): RunsPerGroupResult {
  const fn = 'runsPerGroupForCvRatio';
  const { ratio, sdLogCv } = input;
  const alpha = input.alpha ?? 0.05;
  const power = input.power ?? 0.8;
  assertNumber(fn, 'ratio', ratio, 'positive');
  if (ratio === 1) throw new StatsError(`${fn} requires a ratio other than 1`);
  assertNumber(fn, 'sdLogCv', sdLogCv, 'positive');
  assertNumber(fn, 'alpha', alpha, 'probability');
  assertNumber(fn, 'power', power, 'probability');
  if (power <= alpha) throw new StatsError(`${fn} requires a power above alpha (got ${power} for ${alpha})`);
  const effectSize = Math.abs(Math.log(ratio)) / sdLogCv;
  const powerAt = (n: number): number => {
    const df = 2 * n - 2;
    const ncp = effectSize * Math.sqrt(n / 2);
    const critical = studentTQuantile(1 - alpha / 2, df);
    return 1 - jStat.noncentralt.cdf(critical, df, ncp) + jStat.noncentralt.cdf(-critical, df, ncp);
  };
  const lower = 1.05;
  if (powerAt(lower) >= power) throw new StatsError(`${fn} requires an effect small enough to need more than one run per group`);
  let upper = 4;
  while (powerAt(upper) < power) {
    upper *= 2;
    if (upper > 1e8) throw new StatsError(`${fn} requires an effect large enough to detect with fewer than 1e8 runs per group`);
  }
  const exact = brentRoot((n) => powerAt(n) - power, lower, upper, 1e-10);
  const perGroup = Math.max(2, Math.ceil(exact));
  return { kind: fn, exact, perGroup, effectSize, achievedPower: powerAt(perGroup) };
}
