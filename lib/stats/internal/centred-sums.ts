import { compensatedSumOfDeviations } from './compensated-sum-of';
import { powerOfTwoScale } from './power-of-two-scale';

/**
 * Deviations from a centre and their corrected sum of squares, computed with a power-of-two
 * scale: returns `scale` and `q` such that Σ(x − c)² = scale² · q (`scaledDeviations` gives the
 * scaled deviations when a caller needs them).
 * q uses the corrected two-pass formula q = Σe² − (Σe)²/n (Chan, Golub & LeVeque 1983), which
 * removes the first-order error left when the centre is a rounded mean. Sums are
 * Kahan–Babuška–Neumaier compensated, the same operations as simple-statistics `sum` over the
 * scaled deviations (`compensatedSumOfDeviations`), without allocating them.
 *
 * References: Chan, Golub & LeVeque, "Algorithms for computing the sample variance", The American
 * Statistician 37 (1983) 242–247; Neumaier, ZAMM 54 (1974) 39–51.
 * @throws never (callers validate)
 * @example
 * centredSums([1, 2, 3], 2); // { scale: 1, q: 2 }
 */
export function centredSums(values: ArrayLike<number>, centre: number): { scale: number; q: number } {
  let maxAbs = 0;
  for (let i = 0; i < values.length; i++) maxAbs = Math.max(maxAbs, Math.abs(values[i]! - centre));
  const scale = powerOfTwoScale(maxAbs);
  const s1 = compensatedSumOfDeviations(values, centre, scale, 1);
  const s2 = compensatedSumOfDeviations(values, centre, scale, 2);
  const q = Math.max(0, s2 - (s1 * s1) / values.length);
  return { scale, q };
}

/** The deviations from `centre` divided by `scale` (as `centredSums` sums them). */
export function scaledDeviations(values: readonly number[], centre: number, scale: number): number[] {
  return values.map((v) => (v - centre) / scale);
}
