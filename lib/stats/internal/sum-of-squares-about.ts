import { centredSums } from './centred-sums';

/**
 * Σ(xᵢ − c)² by the corrected two-pass formula with power-of-two scaling (see `centredSums`).
 * When c is the sample mean this is the within-sample sum of squares.
 *
 * References: Chan, Golub & LeVeque, The American Statistician 37 (1983) 242–247.
 * @throws never (callers validate)
 * @example
 * sumOfSquaresAbout([1, 2, 3], 2); // 2
 */
export function sumOfSquaresAbout(values: readonly number[], centre: number): number {
  const { scale, q } = centredSums(values, centre);
  return scale * scale * q;
}
