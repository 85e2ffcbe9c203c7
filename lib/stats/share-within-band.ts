import { assertNumber } from './internal/assert-number';
import { assertValues } from './internal/assert-values';
import { StatsError } from './stats-error';

/**
 * Share of values inside target ± band % (boundaries count as inside): count, n and share (0..1).
 *
 * Algorithm: one scan against [target·(1 − band/100), target·(1 + band/100)]; a relative slack of
 * 1e-12 on the limits keeps values that sit on the boundary but were rounded (for example 110.00000000000001
 * for 100 + 10 %) inside.
 *
 * References: docs/REFERENCE.md §9 (per-stud load as % of target, common practice).
 *
 * @throws {StatsError} no values, non-finite input, `shareWithinBand requires a positive target`,
 *   `shareWithinBand requires a positive bandPercent (got 0)`.
 * @example
 * shareWithinBand([95, 100, 111, 89], 100, 10); // { count: 2, n: 4, share: 0.5, lower: 90, upper: 110 }
 */
export function shareWithinBand(
  values: readonly number[],
  target: number,
  bandPercent: number,
): { count: number; n: number; share: number; lower: number; upper: number } {
  assertValues('shareWithinBand', values, 1);
  assertNumber('shareWithinBand', 'target', target, 'positive');
  assertNumber('shareWithinBand', 'bandPercent', bandPercent, 'positive');
  if (bandPercent >= 100) throw new StatsError(`shareWithinBand requires a bandPercent below 100 (got ${bandPercent})`);
  const lower = target * (1 - bandPercent / 100);
  const upper = target * (1 + bandPercent / 100);
  const slack = 1e-12 * target;
  const count = values.filter((v) => v >= lower - slack && v <= upper + slack).length;
  return { count, n: values.length, share: count / values.length, lower, upper };
}
