import { StatsError } from '../stats-error';
import { describeNumber } from './describe-number';

/**
 * Validates a sample: at least `minCount` values, every one a finite number. NaN is never skipped.
 * Messages: `mean requires at least one value`, `sampleVariance requires at least two values`,
 * `mean requires finite values (got NaN at index 3)`. `where` adds context such as `of group 2`.
 *
 * References: house style, STYLE.md "The statistics layer".
 * @throws {StatsError} when the sample is too short or holds a non-finite value.
 * @example
 * assertValues('mean', [1, 2], 1); // passes
 */
export function assertValues(fn: string, values: readonly number[], minCount: number, where = ''): void {
  if (!Array.isArray(values)) throw new StatsError(`${fn} requires an array of values${where ? ` ${where}` : ''}`);
  const suffix = where ? ` ${where}` : '';
  if (values.length < minCount) {
    const words = ['zero', 'one', 'two', 'three', 'four'];
    const count = words[minCount] ?? String(minCount);
    const got = values.length > 0 ? ` (got ${values.length})` : '';
    throw new StatsError(`${fn} requires at least ${count} value${minCount === 1 ? '' : 's'}${suffix}${got}`);
  }
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new StatsError(`${fn} requires finite values (got ${describeNumber(v)} at index ${i}${suffix})`);
    }
  }
}
