import { StatsError } from './stats-error';
import { assertNumber } from './internal/assert-number';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';
import { regressionThroughOrigin } from './regression-through-origin';
import { studentTQuantile } from './student-t-quantile';

/** Result of {@link nutFactor}. */
export interface NutFactorResult {
  kind: 'nutFactor';
  units: 'SI' | 'US';
  /** K of each reading, T/(D·F) (SI) or 12·T/(D·F) (US). */
  perReading: number[];
  meanOfReadings: number;
  /** K from the regression of T on D·F through the origin. */
  fitted: number;
  standardError: number;
  confidenceInterval: { lower: number; upper: number; confidence: number };
  dfResidual: number;
  n: number;
}

/**
 * Nut factor K from torque–tension readings, by the short-form relation T = K·D·F (common practice):
 * per reading K = T/(D·F), and a fitted K from the least-squares line of T on D·F through the
 * origin, with a t-based confidence interval (df = n − 1).
 *
 * Units: 'SI' takes T in N·m, D in m, F in N. 'US' takes T in ft-lb, D in in, F in lbf, with
 * T = K·D·F/12 (docs/REFERENCE.md §3, common practice). K is dimensionless and the same in both.
 *
 * Algorithm: `regressionThroughOrigin` (Householder QR) on x = D·F (SI) or D·F/12 (US);
 * interval K ± t₁₋α/₂,n−1·SE with `studentTQuantile`.
 *
 * References: docs/REFERENCE.md §3 (T = K·D·F; US form; worked check 3/4 in, 17,535 lb, K = 0.20 → ≈ 219 ft-lb);
 * Shigley & Mischke, Mechanical Engineering Design §8-8 (torque–tension short form).
 *
 * @throws {StatsError} `nutFactor requires at least two values of torque (got 1)`, mismatched lengths,
 *   non-finite values, `nutFactor requires positive torque, diameter and force (got 0 at reading 3)`.
 * @example
 * nutFactor({ torque: [219.1875, 438.375], diameter: [0.75, 0.75], force: [17535, 35070] }, { units: 'US' }).fitted; // 0.2
 */
export function nutFactor(
  readings: { torque: readonly number[]; diameter: readonly number[]; force: readonly number[] },
  options: { units: 'SI' | 'US'; confidence?: number },
): NutFactorResult {
  const { torque, diameter, force } = readings;
  assertValues('nutFactor', torque, 2, 'of torque');
  assertValues('nutFactor', diameter, 2, 'of diameter');
  assertValues('nutFactor', force, 2, 'of force');
  if (diameter.length !== torque.length || force.length !== torque.length) {
    throw new StatsError(
      `nutFactor requires as many diameters and forces as torques (got ${torque.length}, ${diameter.length}, ${force.length})`,
    );
  }
  if (options.units !== 'SI' && options.units !== 'US') {
    throw new StatsError(`nutFactor requires units 'SI' or 'US' (got ${String(options.units)})`);
  }
  const confidence = options.confidence ?? 0.95;
  assertNumber('nutFactor', 'confidence', confidence, 'probability');
  torque.forEach((t, i) => {
    const bad = [t, diameter[i]!, force[i]!].find((v) => !(v > 0));
    if (bad !== undefined) throw new StatsError(`nutFactor requires positive torque, diameter and force (got ${bad} at reading ${i + 1})`);
  });
  const factor = options.units === 'US' ? 1 / 12 : 1;
  const x = torque.map((_, i) => diameter[i]! * force[i]! * factor);
  const perReading = torque.map((t, i) => t / x[i]!);
  const fit = regressionThroughOrigin([x], torque);
  const fitted = fit.coefficients[0]!;
  const standardError = fit.standardErrors[0]!;
  const half = studentTQuantile(1 - (1 - confidence) / 2, fit.dfResidual) * standardError;
  return {
    kind: 'nutFactor',
    units: options.units,
    perReading,
    meanOfReadings: mean(perReading),
    fitted,
    standardError,
    confidenceInterval: { lower: fitted - half, upper: fitted + half, confidence },
    dfResidual: fit.dfResidual,
    n: torque.length,
  };
}
