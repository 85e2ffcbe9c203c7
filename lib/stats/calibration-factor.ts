import { regressionThroughOrigin } from './regression-through-origin';
import { studentTQuantile } from './student-t-quantile';
import { StatsError } from './stats-error';

/** Result of {@link calibrationFactor}. */
export interface CalibrationFactorResult {
  /** Reference load per unit of indicated load (the slope through the origin). */
  factor: number;
  standardError: number;
  /** Two-sided interval of the factor at `confidence`. */
  lower: number;
  upper: number;
  confidence: number;
  dfResidual: number;
  n: number;
}

/**
 * The calibration factor of a gauge against a reference: the slope k of reference = k · indicated,
 * fitted by least squares through the origin (no load means no reading), with its two-sided
 * Student-t interval k ± t(1 − α/2, n − 1) · SE(k).
 *
 * Algorithm: {@link regressionThroughOrigin} (Householder QR); SE(k) = s / √Σx²; the t quantile by
 * {@link studentTQuantile}.
 *
 * References: NIST StRD Linear Regression, NoInt1 and NoInt2 (certified slope and its standard
 * deviation); NIST/SEMATECH e-Handbook §4.5.2 (calibration) and §2.3.6 (linear calibration).
 *
 * @throws {StatsError} `calibrationFactor requires a confidence in (0, 1) (got 1)`; the errors of
 *   `regressionThroughOrigin` (at least two points, finite values, matching lengths).
 * @example
 * calibrationFactor([3, 4, 4], [4, 5, 6]).factor; // 0.7272727272727273 (NIST NoInt2 certified B1 = 0.727272727272727)
 */
export function calibrationFactor(reference: readonly number[], indicated: readonly number[], confidence = 0.95): CalibrationFactorResult {
  if (!(confidence > 0 && confidence < 1)) throw new StatsError(`calibrationFactor requires a confidence in (0, 1) (got ${confidence})`);
  const fit = regressionThroughOrigin([indicated], reference);
  const factor = fit.coefficients[0]!;
  const standardError = fit.standardErrors[0]!;
  const half = studentTQuantile(1 - (1 - confidence) / 2, fit.dfResidual) * standardError;
  return { factor, standardError, lower: factor - half, upper: factor + half, confidence, dfResidual: fit.dfResidual, n: fit.n };
}
