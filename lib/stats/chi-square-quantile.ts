import gammainc from '@stdlib/math-base-special-gammainc';
import { jStat } from 'jstat';
import { assertNumber } from './internal/assert-number';

/**
 * Quantile of the chi-square distribution with k degrees of freedom: the x with P(X ≤ x) = p.
 *
 * Algorithm: jstat's `chisquare.inv` (inverse regularized gamma) as the starting value, then
 * Newton steps on the regularized incomplete gamma from @stdlib — on the lower tail P(k/2, x/2)
 * when p ≤ 0.5 and on the upper tail Q(k/2, x/2) against 1 − p otherwise, so neither tail is
 * formed by subtraction.
 *
 * References: Abramowitz & Stegun 26.4; NIST/SEMATECH e-Handbook §1.3.6.7.4 (critical values of chi-square).
 *
 * @throws {StatsError} `chiSquareQuantile requires a probability in (0, 1) as p (got 0)`, or a non-positive df.
 * @example
 * chiSquareQuantile(0.975, 9); // 19.022767798641635 (scipy.stats.chi2.ppf(0.975, 9) = 19.02276779864163)
 */
export function chiSquareQuantile(p: number, df: number): number {
  assertNumber('chiSquareQuantile', 'p', p, 'probability');
  assertNumber('chiSquareQuantile', 'df', df, 'positive');
  let x = jStat.chisquare.inv(p, df);
  const lowerSide = p <= 0.5;
  for (let i = 0; i < 8; i++) {
    const density = jStat.chisquare.pdf(x, df);
    if (!(density > 0) || !Number.isFinite(density)) break;
    const step = lowerSide
      ? (gammainc(x / 2, df / 2, true, false) - p) / density
      : -(gammainc(x / 2, df / 2, true, true) - (1 - p)) / density;
    const next = x - step;
    x = next > 0 ? next : x / 2;
    if (Math.abs(step) <= 4 * Number.EPSILON * Math.abs(x)) break;
  }
  return x;
}
