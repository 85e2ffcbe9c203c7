import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';
import { valueExtent } from './value-extent';

/**
 * (max − min)/mean as a ratio: the scatter figure reported per pass for strain-gauged studs.
 *
 * Algorithm: `valueExtent` and the refined `mean`.
 *
 * References: docs/REFERENCE.md §9 ("(max − min)/mean", common practice).
 *
 * @throws {StatsError} no values, non-finite input, or `rangeOverMean requires a non-zero mean`.
 * @example
 * rangeOverMean([90, 100, 110]); // 0.2
 */
export function rangeOverMean(values: readonly number[]): number {
  assertValues('rangeOverMean', values, 1);
  const m = mean(values);
  if (m === 0) throw new StatsError('rangeOverMean requires a non-zero mean');
  return valueExtent(values).range / m;
}
