import { StatsError } from './stats-error';
import { assertNumber } from './internal/assert-number';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';
import { sampleVariance } from './sample-variance';
import { studentTQuantile } from './student-t-quantile';
import { studentTUpperTail } from './student-t-upper-tail';

/** Result of {@link welchTTest}. */
export interface WelchTTestResult {
  kind: 'welchTTest';
  /** t = (x̄a − x̄b)/SE. */
  statistic: number;
  /** Welch–Satterthwaite degrees of freedom (fractional). */
  df: number;
  /** Two-sided p-value. */
  pValue: number;
  meanDifference: number;
  standardError: number;
  confidenceInterval: { lower: number; upper: number; confidence: number };
}

/**
 * Welch's two-sample t-test (unequal variances): do the means of two samples differ? Two-sided,
 * with a confidence interval for x̄a − x̄b.
 *
 * Algorithm: SE = √(sa²/na + sb²/nb), ν = SE⁴/[(sa²/na)²/(na − 1) + (sb²/nb)²/(nb − 1)]
 * (Welch–Satterthwaite); p = 2·P(T > |t|) from `studentTUpperTail`; interval x̄a − x̄b ± t₁₋α/₂,ν·SE.
 *
 * References: Welch, Biometrika 34 (1947) 28–35; NIST/SEMATECH e-Handbook §1.3.5.3 (two-sample
 * t-test, unequal variances); scipy.stats.ttest_ind(equal_var=False) (test reference).
 *
 * @throws {StatsError} `welchTTest requires at least two values of sample a (got 1)`, non-finite
 *   values, `welchTTest requires some variation in at least one sample`.
 * @example
 * welchTTest([1, 2, 3, 4], [2, 4, 6, 8, 10]).statistic; // -2.2514363231593695 (scipy.stats.ttest_ind(..., equal_var=False) = -2.2514363231593695)
 */
export function welchTTest(
  a: readonly number[],
  b: readonly number[],
  options: { confidence?: number } = {},
): WelchTTestResult {
  assertValues('welchTTest', a, 2, 'of sample a');
  assertValues('welchTTest', b, 2, 'of sample b');
  const confidence = options.confidence ?? 0.95;
  assertNumber('welchTTest', 'confidence', confidence, 'probability');
  const va = sampleVariance(a) / a.length;
  const vb = sampleVariance(b) / b.length;
  if (va + vb === 0) throw new StatsError('welchTTest requires some variation in at least one sample');
  const standardError = Math.sqrt(va + vb);
  const meanDifference = mean(a) - mean(b);
  const statistic = meanDifference / standardError;
  const df = (va + vb) ** 2 / ((va * va) / (a.length - 1) + (vb * vb) / (b.length - 1));
  const half = studentTQuantile(1 - (1 - confidence) / 2, df) * standardError;
  return {
    kind: 'welchTTest',
    statistic,
    df,
    pValue: Math.min(1, 2 * studentTUpperTail(Math.abs(statistic), df)),
    meanDifference,
    standardError,
    confidenceInterval: { lower: meanDifference - half, upper: meanDifference + half, confidence },
  };
}
