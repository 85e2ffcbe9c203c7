import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { valueExtent } from './value-extent';

/**
 * Tightening factor αA = Fmax/Fmin (VDI 2230 notation) and the ± scatter about the mean it
 * implies, (αA − 1)/(αA + 1), as a ratio (0.23 = ±23 %).
 *
 * Algorithm: `valueExtent`, then the two ratios.
 *
 * References: docs/REFERENCE.md §5 (αA = FM,max/FM,min, VDI 2230; ± = (αA − 1)/(αA + 1) computed there;
 * worked check αA = 1.6 gives ±23 %).
 *
 * @throws {StatsError} no values, non-finite input, or `tighteningFactor requires positive values (got -1 at index 2)`.
 * @example
 * tighteningFactor([80, 100, 128]); // { alphaA: 1.6, plusMinusScatter: 0.23076923076923078, min: 80, max: 128 }
 */
export function tighteningFactor(values: readonly number[]): {
  alphaA: number;
  plusMinusScatter: number;
  min: number;
  max: number;
} {
  assertValues('tighteningFactor', values, 1);
  values.forEach((v, i) => {
    if (v <= 0) throw new StatsError(`tighteningFactor requires positive values (got ${v} at index ${i})`);
  });
  const { min, max } = valueExtent(values);
  const alphaA = max / min;
  return { alphaA, plusMinusScatter: (alphaA - 1) / (alphaA + 1), min, max };
}
