import betainc from '@stdlib/math-base-special-betainc';
import { assertNumber } from './internal/assert-number';

/**
 * Upper tail of Student's t distribution, P(T > t) with ν degrees of freedom (ν may be fractional,
 * as in Welch's test). A two-sided p-value is 2·studentTUpperTail(|t|, ν).
 *
 * Algorithm: for t ≥ 0, P = ½·I_x(ν/2, ½) with x = ν/(ν + t²); when x > 0.5 the complement
 * z = t²/(ν + t²) is formed directly and stdlib's upper regularized beta
 * `betainc(z, ½, ν/2, true, true)` is used, so the tail is never 1 − cdf. For t < 0 the result is
 * 1 − P(T > |t|), which is ≥ 0.5 and has no cancellation.
 *
 * References: Abramowitz & Stegun 26.7.1 and 26.5.27; NIST/SEMATECH e-Handbook §1.3.6.6.4.
 *
 * @throws {StatsError} `studentTUpperTail requires a finite t (got NaN)`, `studentTUpperTail requires a positive df (got 0)`.
 * @example
 * studentTUpperTail(2.228138851986274, 10); // 0.025 (t₀.₉₇₅,₁₀ from scipy.stats.t.ppf)
 */
export function studentTUpperTail(t: number, df: number): number {
  assertNumber('studentTUpperTail', 't', t);
  assertNumber('studentTUpperTail', 'df', df, 'positive');
  const tAbs = Math.abs(t);
  const t2 = tAbs * tAbs;
  let upper: number;
  if (!Number.isFinite(t2)) upper = 0;
  else {
    const x = df / (df + t2);
    upper = x <= 0.5 ? 0.5 * betainc(x, df / 2, 0.5, true, false) : 0.5 * betainc(t2 / (df + t2), 0.5, df / 2, true, true);
  }
  return t >= 0 ? upper : 1 - upper;
}
