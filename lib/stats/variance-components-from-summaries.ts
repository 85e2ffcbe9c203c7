import { StatsError } from './stats-error';
import { assertNumber } from './internal/assert-number';
import { fQuantile } from './internal/f-quantile';
import { chiSquareQuantile } from './chi-square-quantile';
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

/** One run reduced to what the variance components need. */
export interface VarianceRunSummary {
  /** Values (studs) in the run, at least 2. */
  n: number;
  mean: number;
  /** Sample variance (n − 1 denominator) of the run's values. */
  variance: number;
}

/**
 * Variance components (within run, between runs, with their 95 % intervals) from each run's size,
 * mean and sample variance: the formulas of {@link varianceComponents} (which reduces raw runs to
 * these summaries and calls this), so per-run figures stored when a run was saved give the same
 * answer without reading every value again. S₂² = Σ(nᵢ − 1)sᵢ²/(N − a); S₁² = ñ·var(ȳᵢ).
 *
 * References: as `varianceComponents` (Burdick & Graybill 1992; Ting et al. 1990; Thomas &
 * Hultquist 1978); test reference: tests/stats/run-level-comparisons.test.ts checks both entry
 * points on the same scipy fixtures.
 *
 * @throws {StatsError} fewer than two runs, a run with fewer than two values or a non-finite
 *   figure, `… requires some variation within runs`, or a confidence outside (0, 1). `fn` is the
 *   name the messages carry.
 * @example
 * varianceComponentsFromSummaries([{ n: 2, mean: 2, variance: 2 }, { n: 2, mean: 5, variance: 2 }, { n: 2, mean: 9, variance: 2 }]).betweenRun.anovaEstimate; // 11.333333333333334 (as varianceComponents([[1, 3], [4, 6], [8, 10]]))
 */
export function varianceComponentsFromSummaries(
  runs: readonly VarianceRunSummary[],
  options: { confidence?: number } = {},
  fn = 'varianceComponentsFromSummaries',
): VarianceComponentsResult {
  if (!Array.isArray(runs) || runs.length < 2) throw new StatsError(`${fn} requires at least two runs`);
  runs.forEach((r, i) => {
    if (!(Number.isInteger(r.n) && r.n >= 2)) throw new StatsError(`${fn} requires at least two values of run ${i + 1} (got ${r.n})`);
    if (!Number.isFinite(r.mean) || !Number.isFinite(r.variance) || r.variance < 0) throw new StatsError(`${fn} requires finite figures (run ${i + 1})`);
  });
  const confidence = options.confidence ?? 0.95;
  assertNumber(fn, 'confidence', confidence, 'probability');
  const a = runs.length;
  let n = 0;
  let reciprocal = 0;
  let pooled = 0;
  const means = new Array<number>(a);
  for (let i = 0; i < a; i++) {
    const r = runs[i]!;
    n += r.n;
    reciprocal += 1 / r.n;
    pooled += r.variance * (r.n - 1);
    means[i] = r.mean;
  }
  const balanced = runs.every((r) => r.n === runs[0]!.n);
  const runSize = balanced ? runs[0]!.n : a / reciprocal;
  const n1 = a - 1;
  const n2 = n - a;
  const s2 = pooled / n2;
  if (s2 === 0) throw new StatsError(`${fn} requires some variation within runs`);
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
    kind: 'varianceComponents',
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
