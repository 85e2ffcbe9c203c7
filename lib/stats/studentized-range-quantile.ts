import { jStat } from 'jstat';
import { assertNumber } from './internal/assert-number';
import { StatsError } from './stats-error';

/**
 * Quantile of the studentized range distribution: the q with P(Q ≤ q) = p for k means and ν error
 * degrees of freedom (the Tukey HSD critical value for a 1 − α interval is the p = 1 − α quantile).
 *
 * Algorithm: jstat's `tukey.inv` (port of R's `qtukey`) stops at an absolute step of 1e-4, too
 * coarse for interval end points; its answer is used as a start and refined by the secant method
 * on jstat's `tukey.cdf` until the step is below 1e-12 relative. The result is then as accurate as
 * that cdf (about 1e-9, see `studentizedRangeUpperTail`). Answers are remembered per (p, k, ν), and
 * a quantile already solved at a nearby ν starts the secant instead (see `nearestSolved`).
 *
 * References: Copenhaver & Holland, J. Statist. Comput. Simul. 30 (1988) 1–15; R Core, `qtukey.c`;
 * NIST/SEMATECH e-Handbook §7.4.7.1.
 *
 * @throws {StatsError} `studentizedRangeQuantile requires a probability in (0, 1) as p (got 1)`,
 *   `studentizedRangeQuantile requires at least two means (got 1)`, `... requires df of at least 2 (got 1)`.
 * @example
 * studentizedRangeQuantile(0.95, 3, 10); // 3.876776750017816 (scipy.stats.studentized_range.ppf(0.95, 3, 10) = 3.876776750013158)
 */
export function studentizedRangeQuantile(p: number, means: number, df: number): number {
  assertNumber('studentizedRangeQuantile', 'p', p, 'probability');
  assertNumber('studentizedRangeQuantile', 'means', means, 'positive');
  assertNumber('studentizedRangeQuantile', 'df', df, 'positive');
  if (!Number.isInteger(means) || means < 2)
    throw new StatsError(`studentizedRangeQuantile requires at least two means (got ${means})`);
  if (df < 2) throw new StatsError(`studentizedRangeQuantile requires df of at least 2 (got ${df})`);
  const key = `${p}|${means}|${df}`;
  const known = solved.get(key);
  if (known !== undefined) return known;
  const g = (q: number): number => jStat.tukey.cdf(q, means, df) - p;
  let x0 = nearestSolved(p, means, df) ?? jStat.tukey.inv(p, means, df);
  let x1 = x0 * (1 + 1e-6);
  let g0 = g(x0);
  let g1 = g(x1);
  for (let i = 0; i < 50 && g1 !== g0; i++) {
    const x2 = x1 - (g1 * (x1 - x0)) / (g1 - g0);
    x0 = x1;
    g0 = g1;
    x1 = x2;
    g1 = g(x1);
    // The cdf is good to about 1e-10 absolute: a smaller residual is as close as it can tell.
    if (Math.abs(x1 - x0) <= 1e-12 * Math.abs(x1) || Math.abs(g1) <= 1e-13) break;
  }
  remember(key, p, means, df, x1);
  return x1;
}

/**
 * Answers already found, per (p, k, ν), and per (p, k) the ν solved so far: Games–Howell asks for
 * one quantile per pair at nearby Welch ν, and the nearest solved ν's quantile is a start from
 * which the secant needs a few cdf evaluations instead of jstat's coarse search. At most
 * {@link SOLVED_LIMIT} entries are kept (the oldest go first).
 */
const SOLVED_LIMIT = 2000;
const solved = new Map<string, number>();
const solvedByFamily = new Map<string, Map<number, number>>();

function nearestSolved(p: number, means: number, df: number): number | undefined {
  const family = solvedByFamily.get(`${p}|${means}`);
  if (!family) return undefined;
  let best: number | undefined;
  let bestDistance = Infinity;
  for (const [nu, q] of family) {
    const distance = Math.abs(Math.log(nu / df));
    if (distance < bestDistance) (bestDistance = distance), (best = q);
  }
  // Far apart (more than a factor of 2 in ν, or small ν where q moves fast) the coarse search is safer.
  return bestDistance < Math.log(2) && df >= 10 ? best : undefined;
}

function remember(key: string, p: number, means: number, df: number, q: number): void {
  if (solved.size >= SOLVED_LIMIT) {
    solved.clear();
    solvedByFamily.clear();
  }
  solved.set(key, q);
  const familyKey = `${p}|${means}`;
  const family = solvedByFamily.get(familyKey) ?? new Map<number, number>();
  family.set(df, q);
  solvedByFamily.set(familyKey, family);
}
