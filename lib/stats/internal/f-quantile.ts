import { fUpperTail } from '../f-upper-tail';
import { brentRoot } from './brent-root';

/**
 * Quantile of the F distribution, the x with P(F ≤ x) = p for (d1, d2) degrees of freedom: the
 * root of fUpperTail(x) = 1 − p by Brent's method on a doubling bracket (the upper tail is formed
 * without subtraction, so the root is as accurate as `fUpperTail`).
 *
 * References: Abramowitz & Stegun 26.6; Brent (1973) ch. 4.
 * @throws never (callers validate p in (0, 1) and positive df)
 * @example
 * fQuantile(0.95, 3, 36); // 2.8662655509401795 (scipy.stats.f.ppf(0.95, 3, 36) = 2.86626555094018)
 */
export function fQuantile(p: number, d1: number, d2: number): number {
  const target = 1 - p;
  let upper = 1;
  while (fUpperTail(upper, d1, d2) > target) upper *= 2;
  return brentRoot((x) => fUpperTail(x, d1, d2) - target, 0, upper);
}
