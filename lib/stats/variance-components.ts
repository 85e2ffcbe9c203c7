import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';
import { sampleVariance } from './sample-variance';
import { varianceComponentsFromSummaries, type VarianceComponentsResult } from './variance-components-from-summaries';

export type { VarianceComponentsResult } from './variance-components-from-summaries';

/**
 * Variance components of a one-way random-effects layout (studs within runs): how much of the
 * scatter is stud to stud within a run, and how much is run to run, each with a confidence interval.
 *
 * Algorithm (a runs, run sizes nᵢ, N studs): S₂² = MSW = ΣΣ(y − ȳᵢ)²/(N − a) with n₂ = N − a;
 * balanced: S₁² = MSB = nΣ(ȳᵢ − ȳ)²/(a − 1); unbalanced: the unweighted-means form of Thomas &
 * Hultquist, n replaced by the harmonic mean ñ = a/Σ(1/nᵢ) and S₁² = ñΣ(ȳᵢ − ȳ*)²/(a − 1) with ȳ*
 * the plain mean of the run means (approximate; close when the sizes differ little); n₁ = a − 1.
 * Within: σ²_w = S₂², interval [n₂S₂²/χ²₁₋α/₂,n₂ , n₂S₂²/χ²α/₂,n₂] (exact under normality).
 * Between: σ²_b = (S₁² − S₂²)/ñ, reported truncated at 0; the modified large-sample interval for a
 * difference of expected mean squares (Ting, Burdick, Graybill, Jeyaratnam & Lu 1990), with
 * χ²- and F-quantiles at α/2 and 1 − α/2 (lower-tail):
 * G₁ = 1 − n₁/χ²₁₋α/₂,n₁, H₁ = n₁/χ²α/₂,n₁ − 1, G₂ and H₂ likewise with n₂,
 * G₁₂ = [(F₁₋α/₂ − 1)² − G₁²F₁₋α/₂² − H₂²]/F₁₋α/₂, H₁₂ = [(1 − Fα/₂)² − H₁²Fα/₂² − G₂²]/Fα/₂ (F on n₁, n₂),
 * L = [S₁² − S₂² − √(G₁²S₁⁴ + H₂²S₂⁴ + G₁₂S₁²S₂²)]/ñ, U = [S₁² − S₂² + √(H₁²S₁⁴ + G₂²S₂⁴ + H₁₂S₁²S₂²)]/ñ,
 * both truncated at 0. By construction L = 0 exactly when S₁²/S₂² = F₁₋α/₂ (and U = 0 when it is Fα/₂).
 *
 * References: Burdick & Graybill, Confidence Intervals on Variance Components (Marcel Dekker, 1992)
 * (the MLS intervals of the one-fold nested design, and the unweighted-means treatment of unbalanced
 * designs); Ting, Burdick, Graybill, Jeyaratnam & Lu, J. Statist. Comput. Simul. 35 (1990) 135–143;
 * Graybill & Wang, JASA 75 (1980) 869–873 (the MLS method); Thomas & Hultquist, Ann. Statist. 6
 * (1978) 582–592; test reference: these formulas evaluated with scipy.stats.chi2.ppf and f.ppf in
 * scripts/generate-multiple-comparison-fixtures.py.
 *
 * @throws {StatsError} `varianceComponents requires at least two runs`,
 *   `varianceComponents requires at least two values of run 3 (got 1)`, non-finite values,
 *   `varianceComponents requires some variation within runs`, or a confidence outside (0, 1).
 * Algorithm as implemented: each run is reduced to its size, mean and sample variance, and
 * `varianceComponentsFromSummaries` does the rest (so stored per-run figures give the same answer).
 *
 * @example
 * varianceComponents([[1, 3], [4, 6], [8, 10]]).betweenRun.anovaEstimate; // 11.333333333333334 (hand: MSB = 2·var(2, 5, 9) = 74/3, MSW = 2, (74/3 − 2)/2 = 34/3)
 */
export function varianceComponents(
  runs: readonly (readonly number[])[],
  options: { confidence?: number } = {},
): VarianceComponentsResult {
  const fn = 'varianceComponents';
  if (!Array.isArray(runs) || runs.length < 2) throw new StatsError(`${fn} requires at least two runs`);
  runs.forEach((r, i) => assertValues(fn, r, 2, `of run ${i + 1}`));
  return varianceComponentsFromSummaries(
    runs.map((r) => ({ n: r.length, mean: mean(r), variance: sampleVariance(r) })),
    options,
    fn,
  );
}
