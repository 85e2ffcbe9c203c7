import { StatsError } from './stats-error';
import { fitPrepared, prepareDesign, type RandomInterceptModelResult } from './internal/random-intercept-fit';

export type { RandomInterceptModelResult } from './internal/random-intercept-fit';

/**
 * Linear mixed model with one random intercept per cluster (trainees as blocks):
 * y = Xβ + b_cluster + ε, b ~ N(0, σ²_b), ε ~ N(0, σ²), fitted by REML (default) or ML.
 * Predictors are columns; the intercept is added (as `multipleLinearRegression` does).
 *
 * Algorithm: with θ = σ²_b/σ², V = σ²H and, per cluster of size nᵢ, Hᵢ⁻¹ = I − cᵢ11ᵀ with
 * cᵢ = θ/(1 + nᵢθ) and log|Hᵢ| = log(1 + nᵢθ) (closed forms, so one evaluation costs O(clusters·p²)
 * from per-cluster sums, whatever the number of rows). β and σ² are profiled out:
 * M = XᵀH⁻¹X, β̂ = M⁻¹XᵀH⁻¹y, r² = (y − Xβ̂)ᵀH⁻¹(y − Xβ̂), and the profiled deviance is
 * ML: N(1 + log(2πr²/N)) + Σlog(1 + nᵢθ); REML: (N − p)(1 + log(2πr²/(N − p))) + Σlog(1 + nᵢθ) + log|M|
 * (lme4's criteria, Bates et al. 2015 eqs. 34 and 41). Its derivative in θ is closed-form too:
 * dr²/dθ = −Σ(Σeᵢ)²/(1 + nᵢθ)², d log|M|/dθ = −Σuᵢᵀ M⁻¹uᵢ/(1 + nᵢθ)² (uᵢ the cluster column sums).
 * The one-dimensional search scans log θ from 1e-8 to 1e8 (and beyond if needed), refines every
 * sign change of the derivative by Brent's root finder on log θ to machine precision, and compares
 * the minima with the boundary θ = 0, which is taken, exactly, when the deviance rises from it
 * (as lme4 reports a singular fit, σ²_b = 0). Data are centred first (intercept restored after, its
 * variance through the same linear map); r² and the log-likelihood at the estimate are recomputed
 * from the residuals. The preparation and the fit live in internal/random-intercept-fit.ts, so
 * `randomInterceptModels` can fit several models on one prepared design.
 *
 * References: Bates, Mächler, Bolker & Walker, "Fitting linear mixed-effects models using lme4",
 * J. Statistical Software 67(1) (2015) §3.4–3.5 (profiled deviance and REML criterion);
 * Searle, Casella & McCulloch, Variance Components (1992) §6.6 (per-cluster inverse); Brent (1973).
 * Test reference: lme4 1.1.31 on fixtures from scripts/generate-mixed-model-fixtures.R.
 *
 * @throws {StatsError} mismatched lengths, non-finite values, `randomInterceptModel requires at least two clusters`,
 *   `randomInterceptModel requires more observations than clusters (got 4 for 4)`,
 *   `randomInterceptModel requires predictors that are not collinear`,
 *   `randomInterceptModel requires some variation within clusters`.
 * @example
 * randomInterceptModel([], [1, 2, 4, 5, 3, 6], ['a', 'a', 'b', 'b', 'c', 'c']).clusterVariance; // 1.75
 * // (balanced one-way ANOVA estimate (MSB − MSW)/n = (4.5 − 1)/2, which REML equals when positive)
 */
export function randomInterceptModel(
  predictors: readonly (readonly number[])[],
  y: readonly number[],
  clusters: readonly (string | number)[],
  options: { method?: 'REML' | 'ML' } = {},
): RandomInterceptModelResult {
  const method = options.method ?? 'REML';
  if (method !== 'REML' && method !== 'ML') throw new StatsError(`randomInterceptModel requires a method of REML or ML (got ${String(method)})`);
  return fitPrepared('randomInterceptModel', prepareDesign('randomInterceptModel', predictors, y, clusters), method);
}
