import { StatsError } from './stats-error';

/**
 * Linearity of a calibrated gauge: the largest residual |reference − factor · indicated| over all
 * points, as a percentage of full scale (the largest reference load of the calibration). This is
 * the "terminal-free, through-zero" form: the straight line is the fitted one through the origin.
 *
 * Algorithm: one pass, largest absolute residual.
 *
 * References: NIST/SEMATECH e-Handbook §2.3.6.7 (residuals of a calibration curve); ISO 376:2011
 * §3 (reversibility and interpolation errors as % of the reading); expressing as % of full scale is
 * common practice for strain-gauge load instruments.
 *
 * @throws {StatsError} `linearityError requires as many indicated as reference values (got 2, expected 3)`,
 *   `linearityError requires a positive full scale (got 0)`, non-finite values.
 * @example
 * linearityError([10, 20], [10.1, 19.8], 1, 20); // 1 (residual 0.2 at 20 kN is 1 % of 20 kN)
 */
export function linearityError(reference: readonly number[], indicated: readonly number[], factor: number, fullScale: number): number {
  if (indicated.length !== reference.length) {
    throw new StatsError(`linearityError requires as many indicated as reference values (got ${indicated.length}, expected ${reference.length})`);
  }
  if (reference.length === 0) throw new StatsError('linearityError requires at least one point');
  if (!(fullScale > 0) || !Number.isFinite(fullScale)) throw new StatsError(`linearityError requires a positive full scale (got ${fullScale})`);
  if (!Number.isFinite(factor)) throw new StatsError(`linearityError requires a finite factor (got ${factor})`);
  let largest = 0;
  reference.forEach((y, i) => {
    const x = indicated[i]!;
    if (!Number.isFinite(y) || !Number.isFinite(x)) throw new StatsError(`linearityError requires finite values (got ${Number.isFinite(y) ? x : y} at index ${i})`);
    largest = Math.max(largest, Math.abs(y - factor * x));
  });
  return (largest / fullScale) * 100;
}
