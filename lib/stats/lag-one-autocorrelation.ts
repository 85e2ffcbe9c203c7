import { sum } from 'simple-statistics';
import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { centredSums, scaledDeviations } from './internal/centred-sums';
import { mean } from './mean';

/**
 * Lag-1 sample autocorrelation as NIST StRD defines it:
 * r(1) = Σᵢ₌₁ⁿ⁻¹ (yᵢ − ȳ)(yᵢ₊₁ − ȳ) / Σᵢ₌₁ⁿ (yᵢ − ȳ)². For a sequence of stud loads in tightening
 * order it shows whether neighbours in the sequence move together.
 *
 * Algorithm: refined mean, deviations scaled by a power of two, compensated sums; the denominator
 * is the corrected two-pass sum of squares. Not in simple-statistics.
 *
 * References: NIST StRD Univariate Summary Statistics, certified "Sample Autocorrelation
 * Coefficient (lag 1) r(1)"; NIST/SEMATECH e-Handbook §1.3.5.12.
 *
 * @throws {StatsError} fewer than two values, non-finite input, or
 *   `lagOneAutocorrelation requires values that are not all equal`.
 * @example
 * lagOneAutocorrelation([1, 2, 3, 4]); // 0.25 (hand: (−1.5·−0.5 + −0.5·0.5 + 0.5·1.5)/5 = 1.25/5)
 */
export function lagOneAutocorrelation(values: readonly number[]): number {
  assertValues('lagOneAutocorrelation', values, 2);
  const centre = mean(values);
  const { scale, q } = centredSums(values, centre);
  const scaled = scaledDeviations(values, centre, scale);
  if (q === 0) throw new StatsError('lagOneAutocorrelation requires values that are not all equal');
  const products: number[] = [];
  for (let i = 0; i + 1 < scaled.length; i++) products.push(scaled[i]! * scaled[i + 1]!);
  return sum(products) / q;
}
