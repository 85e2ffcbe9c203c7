import { quantileSorted as ssQuantileSorted } from 'simple-statistics';
import { assertNumber } from './internal/assert-number';
import { StatsError } from './stats-error';

/**
 * Sample quantile at probability p of a sample already sorted ascending, Hyndman & Fan definition
 * 7 (the same answer as `quantile` on the unsorted sample): h = (n − 1)p,
 * Q = x₍⌊h⌋₎ + (h − ⌊h⌋)(x₍⌊h⌋+1₎ − x₍⌊h⌋₎). For several quantiles of one large sample (box plots)
 * it saves `quantile`'s copy and selection per call.
 *
 * Algorithm: simple-statistics `quantileSorted` (7.12, R-7). A sorted sample is finite when its
 * ends are (NaN sorts last in a typed array), so validation is O(1); the order itself is the
 * caller's promise.
 *
 * References: Hyndman & Fan, The American Statistician 50 (1996) 361–365; NIST/SEMATECH
 * e-Handbook §7.2.6.2.
 *
 * @throws {StatsError} `quantileSorted requires at least one value`, non-finite ends, or p outside [0, 1].
 * @example
 * quantileSorted([1, 2, 3, 4], 0.25); // 1.75 (numpy.quantile([1,2,3,4], 0.25) = 1.75)
 */
export function quantileSorted(sorted: ArrayLike<number>, p: number): number {
  const fn = 'quantileSorted';
  if (sorted.length === 0) throw new StatsError(`${fn} requires at least one value`);
  if (!Number.isFinite(sorted[0]) || !Number.isFinite(sorted[sorted.length - 1])) throw new StatsError(`${fn} requires finite values`);
  assertNumber(fn, 'p', p);
  if (p < 0 || p > 1) throw new StatsError(`${fn} requires p between 0 and 1 (got ${p})`);
  return ssQuantileSorted(sorted as number[], p);
}
