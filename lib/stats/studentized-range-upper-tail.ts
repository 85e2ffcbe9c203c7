import { jStat } from 'jstat';
import { assertNumber } from './internal/assert-number';
import { StatsError } from './stats-error';

/**
 * Upper tail of the studentized range distribution, P(Q > q) for k means and ν error degrees of
 * freedom: the adjusted p-value of a Tukey HSD comparison.
 *
 * Algorithm: jstat's `tukey.cdf`, a port of R's `ptukey` (Copenhaver & Holland 1988, AS 190
 * lineage: Gauss–Legendre quadrature over the range of a normal sample, integrated against the
 * chi distribution of s). That routine only computes the lower tail, so this function is
 * 1 − cdf, clamped to [0, 1] — the one place in this layer where a p-value is not taken from a
 * survival function. Consequence: the result is accurate in absolute terms (observed ≤ 1e-9
 * against scipy.stats.studentized_range.sf, see tests) but p-values far below 1e-9 have no
 * relative accuracy; read them as "p < 1e-9".
 *
 * References: Copenhaver & Holland, J. Statist. Comput. Simul. 30 (1988) 1–15; R Core, `ptukey.c`;
 * NIST/SEMATECH e-Handbook §7.4.7.1 (Tukey's method).
 *
 * @throws {StatsError} `studentizedRangeUpperTail requires a non-negative q (got -1)`,
 *   `studentizedRangeUpperTail requires at least two means (got 1)`, `... requires df of at least 2 (got 1)`.
 * @example
 * studentizedRangeUpperTail(3, 3, 10); // 0.13498341518990875 (scipy.stats.studentized_range.sf(3, 3, 10) = 0.13498341518956)
 */
export function studentizedRangeUpperTail(q: number, means: number, df: number): number {
  assertNumber('studentizedRangeUpperTail', 'q', q, 'nonNegative');
  assertNumber('studentizedRangeUpperTail', 'means', means, 'positive');
  assertNumber('studentizedRangeUpperTail', 'df', df, 'positive');
  if (!Number.isInteger(means) || means < 2)
    throw new StatsError(`studentizedRangeUpperTail requires at least two means (got ${means})`);
  if (df < 2) throw new StatsError(`studentizedRangeUpperTail requires df of at least 2 (got ${df})`);
  const cdf = jStat.tukey.cdf(q, means, df);
  return Math.min(1, Math.max(0, 1 - cdf));
}
