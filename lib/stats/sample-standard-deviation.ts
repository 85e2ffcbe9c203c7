import { assertValues } from './internal/assert-values';
import { centredSums } from './internal/centred-sums';
import { mean } from './mean';

/**
 * Sample standard deviation s (denominator n − 1).
 *
 * Algorithm: corrected two-pass (Chan, Golub & LeVeque 1983) on deviations scaled by a power of
 * two, s = scale · √(q/(n − 1)); the square root is taken before the scale is restored, so the SD
 * of values near 1e300 (whose variance overflows) and near 1e-300 (whose variance underflows) is
 * still returned correctly. Own implementation rather than simple-statistics' `sampleStandardDeviation`
 * for the reasons given in `sampleVariance`.
 *
 * References: NIST StRD Univariate Summary Statistics (certified s, denom. n − 1); Chan, Golub &
 * LeVeque, The American Statistician 37 (1983) 242–247.
 *
 * @throws {StatsError} `sampleStandardDeviation requires at least two values (got 1)`, or non-finite input.
 * @example
 * sampleStandardDeviation([2, 4, 4, 4, 5, 5, 7, 9]); // 2.138089935299395 (= √(32/7))
 */
export function sampleStandardDeviation(values: readonly number[]): number {
  assertValues('sampleStandardDeviation', values, 2);
  const { scale, q } = centredSums(values, mean(values));
  return scale * Math.sqrt(q / (values.length - 1));
}
