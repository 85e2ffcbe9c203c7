import { sum } from 'simple-statistics';
import { powerOfTwoScale } from './power-of-two-scale';

/**
 * Deviations from a centre and their corrected sum of squares, computed with a power-of-two
 * scale: returns `scale` and `q` such that Σ(x − c)² = scale² · q, plus the scaled deviations.
 * q uses the corrected two-pass formula q = Σe² − (Σe)²/n (Chan, Golub & LeVeque 1983), which
 * removes the first-order error left when the centre is a rounded mean. Sums are
 * Kahan–Babuška–Neumaier compensated (simple-statistics `sum`).
 *
 * References: Chan, Golub & LeVeque, "Algorithms for computing the sample variance", The American
 * Statistician 37 (1983) 242–247; Neumaier, ZAMM 54 (1974) 39–51.
 * @throws never (callers validate)
 * @example
 * centredSums([1, 2, 3], 2); // { scale: 1, q: 2, scaled: [-1, 0, 1] }
 */
export function centredSums(
  values: readonly number[],
  centre: number,
): { scale: number; q: number; scaled: number[] } {
  const deviations = values.map((v) => v - centre);
  let maxAbs = 0;
  for (const d of deviations) maxAbs = Math.max(maxAbs, Math.abs(d));
  const scale = powerOfTwoScale(maxAbs);
  const scaled = deviations.map((d) => d / scale);
  const s1 = sum(scaled);
  const s2 = sum(scaled.map((e) => e * e));
  const q = Math.max(0, s2 - (s1 * s1) / values.length);
  return { scale, q, scaled };
}
