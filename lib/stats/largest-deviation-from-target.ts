import { assertNumber } from './internal/assert-number';
import { assertValues } from './internal/assert-values';
import { StatsError } from './stats-error';

/**
 * The value farthest from a target (for stud loads: the target preload): its index, signed
 * deviation (value − target) and that deviation in % of the target. Ties go to the first value.
 *
 * Algorithm: one scan.
 *
 * References: docs/REFERENCE.md §9 (report per-stud load as % of target, common practice).
 *
 * @throws {StatsError} no values, non-finite input, non-finite target, or
 *   `largestDeviationFromTarget requires a non-zero target`.
 * @example
 * largestDeviationFromTarget([95, 108, 101], 100); // { index: 1, value: 108, deviation: 8, percent: 8 }
 */
export function largestDeviationFromTarget(
  values: readonly number[],
  target: number,
): { index: number; value: number; deviation: number; percent: number } {
  assertValues('largestDeviationFromTarget', values, 1);
  assertNumber('largestDeviationFromTarget', 'target', target);
  if (target === 0) throw new StatsError('largestDeviationFromTarget requires a non-zero target');
  let index = 0;
  for (let i = 1; i < values.length; i++) {
    if (Math.abs(values[i]! - target) > Math.abs(values[index]! - target)) index = i;
  }
  const value = values[index]!;
  const deviation = value - target;
  return { index, value, deviation, percent: (deviation / target) * 100 };
}
