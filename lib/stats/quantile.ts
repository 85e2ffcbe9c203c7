import { quantile as ssQuantile } from 'simple-statistics';
import { assertNumber } from './internal/assert-number';
import { assertValues } from './internal/assert-values';
import { StatsError } from './stats-error';

/**
 * Sample quantile at probability p (0 ≤ p ≤ 1), Hyndman & Fan definition 7 (R's default `type = 7`,
 * numpy's `linear`): h = (n − 1)p, Q = x₍⌊h⌋₎ + (h − ⌊h⌋)(x₍⌊h⌋+1₎ − x₍⌊h⌋₎) on the sorted sample.
 *
 * Algorithm: simple-statistics `quantile` (7.12 implements exactly R-7 with quickselect on a
 * copy); this wrapper adds validation that NaN is rejected, not sorted somewhere.
 *
 * References: Hyndman & Fan, "Sample quantiles in statistical packages", The American Statistician
 * 50 (1996) 361–365; NIST/SEMATECH e-Handbook §7.2.6.2 (percentiles).
 *
 * @throws {StatsError} no values, non-finite input, or `quantile requires p between 0 and 1 (got 1.5)`.
 * @example
 * quantile([1, 2, 3, 4], 0.25); // 1.75 (numpy.quantile([1,2,3,4], 0.25) = 1.75)
 */
export function quantile(values: readonly number[], p: number): number {
  assertValues('quantile', values, 1);
  assertNumber('quantile', 'p', p);
  if (p < 0 || p > 1) throw new StatsError(`quantile requires p between 0 and 1 (got ${p})`);
  return ssQuantile(values as number[], p);
}
