import { StatsError } from './stats-error';
import { describeNumber } from './internal/describe-number';

/**
 * Holm's step-down adjustment of p-values for a family of m tests (for example the tests of one
 * comparison): rejecting where the adjusted p ≤ α holds the family-wise error rate at α under any
 * dependence, and is uniformly more powerful than Bonferroni.
 *
 * Algorithm: sort ascending, p̃₍ᵢ₎ = max over j ≤ i of min(1, (m − j + 1)·p₍ⱼ₎), returned in input
 * order (ties keep their order; equal p-values get equal adjusted values).
 *
 * References: Holm, "A simple sequentially rejective multiple test procedure", Scandinavian Journal
 * of Statistics 6 (1979) 65–70; Wright, "Adjusted p-values for simultaneous inference", Biometrics 48
 * (1992) 1005–1013 (the adjusted-p form); test reference statsmodels.stats.multitest.multipletests(method='holm').
 *
 * @throws {StatsError} `holmAdjust requires at least one p-value`,
 *   `holmAdjust requires p-values between 0 and 1 (got 1.2 at index 0)`.
 * @example
 * holmAdjust([0.01, 0.04, 0.03]); // [0.03, 0.06, 0.06] (hand: 3·0.01; max(0.03, 2·0.03); max(0.06, 1·0.04))
 */
export function holmAdjust(pValues: readonly number[]): number[] {
  if (!Array.isArray(pValues) || pValues.length === 0) throw new StatsError('holmAdjust requires at least one p-value');
  pValues.forEach((p, i) => {
    if (typeof p !== 'number' || !(p >= 0 && p <= 1)) {
      throw new StatsError(`holmAdjust requires p-values between 0 and 1 (got ${describeNumber(p)} at index ${i})`);
    }
  });
  const m = pValues.length;
  const order = pValues.map((p, i) => ({ p, i })).sort((a, b) => a.p - b.p || a.i - b.i);
  const adjusted = new Array<number>(m);
  let running = 0;
  order.forEach(({ p, i }, rank) => {
    running = Math.max(running, Math.min(1, (m - rank) * p));
    adjusted[i] = running;
  });
  return adjusted;
}
