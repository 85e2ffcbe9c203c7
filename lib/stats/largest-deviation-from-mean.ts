import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';

/**
 * The value farthest from the sample mean: its index, signed deviation (value − mean) and that
 * deviation in % of the mean. Ties go to the first such value.
 *
 * Algorithm: refined mean (see `mean`), then one scan.
 *
 * References: docs/REFERENCE.md §9 ("± % of the mean", common practice).
 *
 * @throws {StatsError} no values, non-finite input, or `largestDeviationFromMean requires a non-zero mean`.
 * @example
 * largestDeviationFromMean([90, 100, 125, 85]); // { index: 2, value: 125, deviation: 25, percent: 25, mean: 100 }
 */
export function largestDeviationFromMean(values: readonly number[]): {
  index: number;
  value: number;
  deviation: number;
  percent: number;
  mean: number;
} {
  assertValues('largestDeviationFromMean', values, 1);
  const m = mean(values);
  if (m === 0) throw new StatsError('largestDeviationFromMean requires a non-zero mean');
  let index = 0;
  for (let i = 1; i < values.length; i++) {
    if (Math.abs(values[i]! - m) > Math.abs(values[index]! - m)) index = i;
  }
  const value = values[index]!;
  const deviation = value - m;
  return { index, value, deviation, percent: (deviation / m) * 100, mean: m };
}
