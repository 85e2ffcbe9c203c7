import { StatsError } from './stats-error';
import { assertNumber } from './internal/assert-number';
import { assertValues } from './internal/assert-values';
import { fQuantile } from './internal/f-quantile';
import { chiSquareQuantile } from './chi-square-quantile';
import { mean } from './mean';
import { sampleVariance } from './sample-variance';

/** Result of {@link varianceComponents}. */
export interface VarianceComponentsResult {
  kind: 'varianceComponents';
  runCount: number;
  n: number;
  balanced: boolean;
  /** Studs per run; the harmonic mean of the run sizes when they differ. */
  runSize: number;
  confidence: number;
  meanSquares: { between: number; within: number; dfBetween: number; dfWithin: number };
  /** Stud-to-stud variance within a run: MSW with its exact chi-square interval. */
  withinRun: { variance: number; lower: number; upper: number; method: 'exact chi-square' };
  /** Run-to-run variance of the run means' true values, truncated at 0, with its MLS interval. */
  betweenRun: {
    variance: number;
    /** (MSB − MSW)/n before truncation (may be negative). */
    anovaEstimate: number;
    lower: number;
    upper: number;
    method: 'modified large-sample' | 'modified large-sample, unweighted means';
  };
}

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
  const confidence = options.confidence ?? 0.95;
  assertNumber(fn, 'confidence', confidence, 'probability');
  const a = runs.length;
  const sizes = runs.map((r) => r.length);
  const n = sizes.reduce((s, v) => s + v, 0);
  const balanced = sizes.every((s) => s === sizes[0]);
  const runSize = balanced ? sizes[0]! : a / sizes.reduce((s, v) => s + 1 / v, 0);
  const n1 = a - 1;
  const n2 = n - a;
  const s2 = runs.reduce((s, r) => s + sampleVariance(r) * (r.length - 1), 0) / n2;
  if (s2 === 0) throw new StatsError(`${fn} requires some variation within runs`);
  const means = runs.map((r) => mean(r));
  const s1 = runSize * sampleVariance(means);

  const alpha = 1 - confidence;
  const g = (nu: number): number => 1 - nu / chiSquareQuantile(1 - alpha / 2, nu);
  const h = (nu: number): number => nu / chiSquareQuantile(alpha / 2, nu) - 1;
  const [g1, h1, g2, h2] = [g(n1), h(n1), g(n2), h(n2)];
  const fHigh = fQuantile(1 - alpha / 2, n1, n2);
  const fLow = fQuantile(alpha / 2, n1, n2);
  const g12 = ((fHigh - 1) ** 2 - g1 ** 2 * fHigh ** 2 - h2 ** 2) / fHigh;
  const h12 = ((1 - fLow) ** 2 - h1 ** 2 * fLow ** 2 - g2 ** 2) / fLow;
  const vLower = g1 ** 2 * s1 ** 2 + h2 ** 2 * s2 ** 2 + g12 * s1 * s2;
  const vUpper = h1 ** 2 * s1 ** 2 + g2 ** 2 * s2 ** 2 + h12 * s1 * s2;
  const anovaEstimate = (s1 - s2) / runSize;
  const ssw = s2 * n2;
  return {
    kind: fn,
    runCount: a,
    n,
    balanced,
    runSize,
    confidence,
    meanSquares: { between: s1, within: s2, dfBetween: n1, dfWithin: n2 },
    withinRun: {
      variance: s2,
      lower: ssw / chiSquareQuantile(1 - alpha / 2, n2),
      upper: ssw / chiSquareQuantile(alpha / 2, n2),
      method: 'exact chi-square',
    },
    betweenRun: {
      variance: Math.max(0, anovaEstimate),
      anovaEstimate,
      lower: Math.max(0, (s1 - s2 - Math.sqrt(Math.max(0, vLower))) / runSize),
      upper: Math.max(0, (s1 - s2 + Math.sqrt(Math.max(0, vUpper))) / runSize),
      method: balanced ? 'modified large-sample' : 'modified large-sample, unweighted means',
    },
  };
}
