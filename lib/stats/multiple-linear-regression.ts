import { sum } from 'simple-statistics';
import { assertDesign } from './internal/assert-design';
import { householderLeastSquares } from './internal/householder-least-squares';
import { sumOfSquaresAbout } from './internal/sum-of-squares-about';
import { mean } from './mean';

/** Result of {@link multipleLinearRegression} and {@link regressionThroughOrigin}. */
export interface LinearRegressionResult {
  kind: 'linearRegression';
  /** True when coefficients[0] is the intercept. */
  intercept: boolean;
  /** Intercept first (when fitted), then one per predictor in input order. */
  coefficients: number[];
  standardErrors: number[];
  residualSd: number;
  /** Centred R² with an intercept; uncentred 1 − SSR/Σy² through the origin (as NIST StRD certifies). */
  rSquared: number;
  residualSumOfSquares: number;
  dfResidual: number;
  n: number;
}

/**
 * Ordinary least squares with an intercept and any number of predictors:
 * y = b₀ + b₁x₁ + … + b_p x_p, with coefficient standard errors, residual SD and R².
 * For a polynomial, pass the powers as predictors ([x, x²] for NIST Pontius).
 *
 * Algorithm: response and predictors are centred on their refined means, then the centred
 * problem is solved by Householder QR on power-of-two-scaled columns (never the normal equations,
 * which square the condition number and fail NIST Longley). Slopes come from R b = Qᵀy;
 * b₀ = ȳ − Σ bⱼx̄ⱼ; Var(b) = s²R⁻¹R⁻ᵀ and Var(b₀) = s²(1/n + ‖R⁻ᵀx̄‖²); residuals are recomputed
 * from the data. simple-statistics' `linearRegression` handles one predictor only and gives no
 * standard errors.
 *
 * References: NIST StRD Linear Regression (Norris, Pontius, Longley, Filip, Wampler1–5);
 * Golub & Van Loan, Matrix Computations (2013) §5.3; Longley, JASA 62 (1967) 819–841.
 *
 * @throws {StatsError} `multipleLinearRegression requires at least one predictor`, mismatched lengths,
 *   non-finite values, `multipleLinearRegression requires more observations than parameters (got 2 for 2)`,
 *   `multipleLinearRegression requires predictors that are not collinear`.
 * @example
 * multipleLinearRegression([[1, 2, 3, 4]], [3, 5, 7, 10]).coefficients; // [0.5, 2.3] (hand: Sxy/Sxx = 11.5/5)
 */
export function multipleLinearRegression(
  predictors: readonly (readonly number[])[],
  response: readonly number[],
): LinearRegressionResult {
  assertDesign('multipleLinearRegression', predictors, response, predictors.length + 1);
  const n = response.length;
  const yBar = mean(response);
  const xBars = predictors.map((c) => mean(c));
  const yc = response.map((v) => v - yBar);
  const xc = predictors.map((c, j) => c.map((v) => v - xBars[j]!));
  const { coefficients: slopes, rInverse, residuals } = householderLeastSquares('multipleLinearRegression', xc, yc);
  const p = predictors.length;
  const dfResidual = n - p - 1;
  const rss = sum(residuals.map((r) => r * r));
  const s2 = rss / dfResidual;
  const slopeSe = rInverse.map((row) => Math.sqrt(s2 * sum(row.map((v) => v * v))));
  // w = R⁻ᵀ x̄  ⇒  ‖w‖² = x̄ᵀ(XcᵀXc)⁻¹x̄ ; (R⁻ᵀ)[i][j] = rInverse[j][i].
  const w = xBars.map((_, i) => sum(xBars.map((xb, j) => rInverse[j]![i]! * xb)));
  const interceptSe = Math.sqrt(s2 * (1 / n + sum(w.map((v) => v * v))));
  const b0 = yBar - sum(slopes.map((b, j) => b * xBars[j]!));
  const sst = sumOfSquaresAbout(response, yBar);
  return {
    kind: 'linearRegression',
    intercept: true,
    coefficients: [b0, ...slopes],
    standardErrors: [interceptSe, ...slopeSe],
    residualSd: Math.sqrt(s2),
    rSquared: sst === 0 ? Number.NaN : 1 - rss / sst,
    residualSumOfSquares: rss,
    dfResidual,
    n,
  };
}
