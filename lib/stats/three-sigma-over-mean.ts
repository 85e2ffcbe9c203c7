import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';
import { sampleStandardDeviation } from './sample-standard-deviation';

/**
 * 3·s/x̄ as a ratio: the half-width of the ±3σ band (99.73 % of a normal distribution) relative
 * to the mean.
 *
 * Algorithm: corrected two-pass s over the refined mean.
 *
 * References: docs/REFERENCE.md §9 ("3σ/mean; ±3σ covers 99.73 % of a normal distribution", common practice).
 *
 * @throws {StatsError} fewer than two values, non-finite input, or `threeSigmaOverMean requires a non-zero mean`.
 * @example
 * threeSigmaOverMean([90, 100, 110]); // 0.3
 */
export function threeSigmaOverMean(values: readonly number[]): number {
  assertValues('threeSigmaOverMean', values, 2);
  const m = mean(values);
  if (m === 0) throw new StatsError('threeSigmaOverMean requires a non-zero mean');
  return (3 * sampleStandardDeviation(values)) / m;
}
