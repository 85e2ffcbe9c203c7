import { sum } from 'simple-statistics';
import { assertValues } from './internal/assert-values';
import { compensatedSumOfDeviations } from './internal/compensated-sum-of';

/**
 * Arithmetic mean of a sample.
 *
 * Algorithm: compensated (Kahan–Babuška–Neumaier) summation from simple-statistics `sum`, then one
 * correcting pass that adds the mean of the residuals, m = m₀ + Σ(xᵢ − m₀)/n (the same refinement R's
 * `mean()` applies). simple-statistics' own `mean` stops after the first step; the second pass is
 * what lets NIST StRD NumAcc3/NumAcc4 (values 1e6 + small, 1e7 + small) reach full precision. When
 * the plain sum overflows (values near 1e308) the values are divided by n before summing.
 *
 * References: NIST StRD Univariate Summary Statistics (certified sample mean);
 * Neumaier, ZAMM 54 (1974) 39–51; R Core, `summary.c` (mean with a second pass).
 *
 * @throws {StatsError} `mean requires at least one value`, `mean requires finite values (got NaN at index 3)`
 * @example
 * mean([1, 2, 3, 4]); // 2.5 (hand computation)
 */
export function mean(values: readonly number[]): number {
  assertValues('mean', values, 1);
  const n = values.length;
  let first = sum(values as number[]) / n;
  // The same sums as sum(values.map(…)), without the copies (compensatedSumOfDeviations).
  if (!Number.isFinite(first)) first = compensatedSumOfDeviations(values, 0, n, 1);
  const centre = first;
  const correction = compensatedSumOfDeviations(values, centre, 1, 1) / n;
  const refined = first + correction;
  return Number.isFinite(refined) ? refined : first;
}
