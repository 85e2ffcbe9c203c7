import { sum } from 'simple-statistics';
import { assertDesign } from './internal/assert-design';
import { householderLeastSquares } from './internal/householder-least-squares';
import type { LinearRegressionResult } from './multiple-linear-regression';

/**
 * Least squares without an intercept, y = b₁x₁ + … + b_p x_p (the line is forced through the
 * origin: for torque against D·F, zero load means zero torque).
 *
 * Algorithm: Householder QR on power-of-two-scaled, uncentred columns; Var(b) = s²R⁻¹R⁻ᵀ with
 * s² = SSR/(n − p); R² is the uncentred 1 − SSR/Σy², which is what NIST StRD certifies for NoInt1
 * and NoInt2.
 *
 * References: NIST StRD Linear Regression, NoInt1 and NoInt2; Golub & Van Loan (2013) §5.3.
 *
 * @throws {StatsError} `regressionThroughOrigin requires at least one predictor`, mismatched lengths,
 *   non-finite values, `regressionThroughOrigin requires more observations than parameters (got 1 for 1)`,
 *   `regressionThroughOrigin requires predictors that are not collinear`.
 * @example
 * regressionThroughOrigin([[4, 5, 6]], [3, 4, 4]).coefficients; // [0.7272727272727273] (NIST NoInt2 certified B1 = 0.727272727272727)
 */
export function regressionThroughOrigin(
  predictors: readonly (readonly number[])[],
  response: readonly number[],
): LinearRegressionResult {
  assertDesign('regressionThroughOrigin', predictors, response, predictors.length);
  const n = response.length;
  const { coefficients, rInverse, residuals } = householderLeastSquares('regressionThroughOrigin', predictors, response);
  const dfResidual = n - predictors.length;
  const rss = sum(residuals.map((r) => r * r));
  const s2 = rss / dfResidual;
  const uncentred = sum(response.map((v) => v * v));
  return {
    kind: 'linearRegression',
    intercept: false,
    coefficients,
    standardErrors: rInverse.map((row) => Math.sqrt(s2 * sum(row.map((v) => v * v)))),
    residualSd: Math.sqrt(s2),
    rSquared: uncentred === 0 ? Number.NaN : 1 - rss / uncentred,
    residualSumOfSquares: rss,
    dfResidual,
    n,
  };
}
