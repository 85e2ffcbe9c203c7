import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';
import { sampleStandardDeviation } from './sample-standard-deviation';

/**
 * Sample coefficient of variation CV = s/x̄ as a ratio (multiply by 100 for %). For stud loads
 * this is the usual one-number measure of scatter.
 *
 * Algorithm: corrected two-pass s (see `sampleStandardDeviation`) over the refined mean. Not
 * simple-statistics' `coefficientOfVariation`, which uses the uncorrected SD.
 *
 * References: docs/REFERENCE.md §9 (CV = σ/µ, for a sample s/x̄); NIST/SEMATECH e-Handbook §1.3.5.6.
 *
 * @throws {StatsError} fewer than two values, non-finite input, or
 *   `coefficientOfVariation requires a non-zero mean`.
 * @example
 * coefficientOfVariation([90, 100, 110]); // 0.1 (s = 10, mean = 100)
 */
export function coefficientOfVariation(values: readonly number[]): number {
  assertValues('coefficientOfVariation', values, 2);
  const m = mean(values);
  if (m === 0) throw new StatsError('coefficientOfVariation requires a non-zero mean');
  return sampleStandardDeviation(values) / m;
}
