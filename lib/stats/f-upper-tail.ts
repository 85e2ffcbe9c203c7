import betainc from '@stdlib/math-base-special-betainc';
import { assertNumber } from './internal/assert-number';

/**
 * Upper tail (survival function) of the F distribution, P(F > f) for F(d₁, d₂): the p-value of
 * an ANOVA or Levene statistic.
 *
 * Algorithm: regularized incomplete beta from @stdlib, with accuracy-aware branching so the tail
 * is never formed as 1 − cdf: with x = d₁f/(d₁f + d₂), P = I₁₋ₓ(d₂/2, d₁/2). When x ≤ 0.5 this is
 * stdlib's upper regularized beta `betainc(x, d₁/2, d₂/2, true, true)`; when x > 0.5 the small
 * argument y = d₂/(d₁f + d₂) is formed directly (no 1 − x cancellation) and the lower regularized
 * beta `betainc(y, d₂/2, d₁/2)` is used.
 *
 * References: Abramowitz & Stegun 26.6.2; NIST/SEMATECH e-Handbook §1.3.6.6.5 (F distribution);
 * stdlib-js `@stdlib/math/base/special/betainc`.
 *
 * @throws {StatsError} `fUpperTail requires a non-negative f (got -1)`, `fUpperTail requires a positive dfNumerator (got 0)`.
 * @example
 * fUpperTail(3.5, 2, 10); // 0.07042962777237427 (scipy.stats.f.sf(3.5, 2, 10) = 0.07042962777237427; exact 1.7^-5)
 */
export function fUpperTail(f: number, dfNumerator: number, dfDenominator: number): number {
  if (f !== Number.POSITIVE_INFINITY) assertNumber('fUpperTail', 'f', f, 'nonNegative');
  assertNumber('fUpperTail', 'dfNumerator', dfNumerator, 'positive');
  assertNumber('fUpperTail', 'dfDenominator', dfDenominator, 'positive');
  if (f === Number.POSITIVE_INFINITY) return 0;
  if (f === 0) return 1;
  const a = dfNumerator * f;
  const x = a / (a + dfDenominator);
  if (x <= 0.5) return betainc(x, dfNumerator / 2, dfDenominator / 2, true, true);
  const y = dfDenominator / (a + dfDenominator);
  return betainc(y, dfDenominator / 2, dfNumerator / 2, true, false);
}
