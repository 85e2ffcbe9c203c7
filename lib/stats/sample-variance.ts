import { assertValues } from './internal/assert-values';
import { centredSums } from './internal/centred-sums';
import { mean } from './mean';

/**
 * Sample variance s² (denominator n − 1).
 *
 * Algorithm: corrected two-pass — the mean first (see `mean`), then
 * s² = [Σ(xᵢ − x̄)² − (Σ(xᵢ − x̄))²/n]/(n − 1) with compensated sums (Chan, Golub & LeVeque 1983).
 * simple-statistics' `sampleVariance` is the plain two-pass formula with naive summation, which
 * loses digits on NIST NumAcc4 (1e7 + small) and overflows or underflows when values are near
 * 1e300 or 1e-300; here the deviations are scaled by a power of two before squaring, so the only
 * overflow left is a variance that truly exceeds the double range (then Infinity is returned).
 *
 * References: NIST StRD Univariate Summary Statistics; Chan, Golub & LeVeque, The American
 * Statistician 37 (1983) 242–247; NIST/SEMATECH e-Handbook §1.3.5.6 (measures of scale).
 *
 * @throws {StatsError} `sampleVariance requires at least two values (got 1)`, or non-finite input.
 * @example
 * sampleVariance([2, 4, 4, 4, 5, 5, 7, 9]); // 4.571428571428571 (= 32/7, hand computation)
 */
export function sampleVariance(values: readonly number[]): number {
  assertValues('sampleVariance', values, 2);
  const { scale, q } = centredSums(values, mean(values));
  return ((scale * scale) * q) / (values.length - 1);
}
