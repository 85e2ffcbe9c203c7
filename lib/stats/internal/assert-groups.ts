import { StatsError } from '../stats-error';
import { assertValues } from './assert-values';

/**
 * Validates a list of groups for a comparison: at least `minGroups` groups, each with at least
 * `minPerGroup` finite values. Messages: `oneWayAnova requires at least two groups`,
 * `bartlettTest requires at least two values of group 3 (got 1)`,
 * `leveneTest requires finite values (got NaN at index 0 of group 2)`. Groups are numbered from 1.
 *
 * References: house style, STYLE.md "The statistics layer".
 * @throws {StatsError} when the groups are too few, too small or hold a non-finite value.
 * @example
 * assertGroups('oneWayAnova', [[1, 2], [3, 4]], 2, 1); // passes
 */
export function assertGroups(
  fn: string,
  groups: readonly (readonly number[])[],
  minGroups: number,
  minPerGroup: number,
): void {
  if (!Array.isArray(groups) || groups.length < minGroups) {
    const words = ['zero', 'one', 'two', 'three'];
    throw new StatsError(`${fn} requires at least ${words[minGroups] ?? String(minGroups)} groups`);
  }
  groups.forEach((g, i) => assertValues(fn, g, minPerGroup, `of group ${i + 1}`));
}
