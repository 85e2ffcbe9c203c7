import { jStat } from 'jstat';
import { assertNumber } from './internal/assert-number';
import { studentTUpperTail } from './student-t-upper-tail';

/**
 * Quantile of Student's t distribution: the t with P(T ≤ t) = p (for a two-sided 95 % interval,
 * p = 0.975).
 *
 * Algorithm: jstat's `studentt.inv` (inverse incomplete beta) as the starting value — observed
 * only 1e-8 relative against scipy — then Newton steps on `studentTUpperTail` (an upper-tail
 * survival function, so no 1 − cdf) with jstat's density, until the step is below 4 ulp.
 *
 * References: Abramowitz & Stegun 26.7; NIST/SEMATECH e-Handbook §1.3.6.7.2 (critical values of t).
 *
 * @throws {StatsError} `studentTQuantile requires a probability in (0, 1) as p (got 1)`, or a non-positive df.
 * @example
 * studentTQuantile(0.975, 10); // 2.2281388519862744 (scipy.stats.t.ppf(0.975, 10) = 2.228138851986274)
 */
export function studentTQuantile(p: number, df: number): number {
  assertNumber('studentTQuantile', 'p', p, 'probability');
  assertNumber('studentTQuantile', 'df', df, 'positive');
  if (p === 0.5) return 0;
  // Work in the upper half; tail = P(T > x) = 1 − p for p > 0.5.
  const upperHalf = p > 0.5;
  const tail = upperHalf ? 1 - p : p;
  let x = jStat.studentt.inv(1 - tail, df);
  for (let i = 0; i < 8; i++) {
    const density = jStat.studentt.pdf(x, df);
    if (!(density > 0)) break;
    const step = (studentTUpperTail(x, df) - tail) / density;
    x += step;
    if (Math.abs(step) <= 4 * Number.EPSILON * Math.abs(x)) break;
  }
  return upperHalf ? x : -x;
}
