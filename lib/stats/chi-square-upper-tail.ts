import gammainc from '@stdlib/math-base-special-gammainc';
import { assertNumber } from './internal/assert-number';

/**
 * Upper tail of the chi-square distribution, P(X > x) with k degrees of freedom: the p-value of
 * Bartlett's test.
 *
 * Algorithm: upper regularized incomplete gamma Q(k/2, x/2) from @stdlib
 * (`gammainc(x/2, k/2, true, true)`), never 1 − cdf.
 *
 * References: Abramowitz & Stegun 26.4.19; NIST/SEMATECH e-Handbook §1.3.6.6.6.
 *
 * @throws {StatsError} `chiSquareUpperTail requires a non-negative x (got -1)`, `chiSquareUpperTail requires a positive df (got 0)`.
 * @example
 * chiSquareUpperTail(2, 2); // 0.36787944117144233 (= e^-1, exact for 2 df)
 */
export function chiSquareUpperTail(x: number, df: number): number {
  if (x !== Number.POSITIVE_INFINITY) assertNumber('chiSquareUpperTail', 'x', x, 'nonNegative');
  assertNumber('chiSquareUpperTail', 'df', df, 'positive');
  if (x === Number.POSITIVE_INFINITY) return 0;
  return gammainc(x / 2, df / 2, true, true);
}
