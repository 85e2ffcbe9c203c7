import { max, min } from 'simple-statistics';
import { assertValues } from './internal/assert-values';

/**
 * Smallest value, largest value and range (max − min) of a sample, with the positions
 * (0-based indices) of the first minimum and first maximum.
 *
 * Algorithm: one linear scan (simple-statistics `min`/`max`, plus index lookup).
 *
 * References: NIST/SEMATECH e-Handbook §1.3.5.6 (range).
 *
 * @throws {StatsError} `valueExtent requires at least one value`, or non-finite input.
 * @example
 * valueExtent([3, 1, 4, 1, 5]); // { min: 1, max: 5, range: 4, minIndex: 1, maxIndex: 4 }
 */
export function valueExtent(values: readonly number[]): {
  min: number;
  max: number;
  range: number;
  minIndex: number;
  maxIndex: number;
} {
  assertValues('valueExtent', values, 1);
  const lo = min(values as number[]);
  const hi = max(values as number[]);
  return { min: lo, max: hi, range: hi - lo, minIndex: values.indexOf(lo), maxIndex: values.indexOf(hi) };
}
