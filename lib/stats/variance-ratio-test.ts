import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { fUpperTail } from './f-upper-tail';
import { sampleVariance } from './sample-variance';

/** Result of {@link varianceRatioTest}. */
export interface VarianceRatioTestResult {
  kind: 'varianceRatioTest';
  /** F = sa²/sb². */
  statistic: number;
  dfNumerator: number;
  dfDenominator: number;
  /** Two-sided p-value, 2·min(P(F ≥ f), P(F ≤ f)), capped at 1. */
  pValue: number;
}

/**
 * Two-sample F-test for equal variances: is the scatter of sample a different from that of
 * sample b? Assumes normal data (prefer `brownForsytheTest` otherwise).
 *
 * Algorithm: F = sa²/sb² with corrected two-pass variances, df (na − 1, nb − 1). Both tails are
 * upper tails: P(F ≥ f) = `fUpperTail(f, da, db)` and P(F ≤ f) = `fUpperTail(1/f, db, da)`, so
 * neither is formed as 1 − cdf.
 *
 * References: NIST/SEMATECH e-Handbook §1.3.5.9 (F-test for equality of two variances);
 * test reference computed with scipy.stats.f.sf/cdf.
 *
 * @throws {StatsError} `varianceRatioTest requires at least two values of sample a (got 1)`,
 *   non-finite values, `varianceRatioTest requires some variation in both samples`.
 * @example
 * varianceRatioTest([1, 2, 3, 4], [2, 4, 6, 8, 10]).statistic; // 0.16666666666666666 (= (5/3)/10)
 */
export function varianceRatioTest(a: readonly number[], b: readonly number[]): VarianceRatioTestResult {
  assertValues('varianceRatioTest', a, 2, 'of sample a');
  assertValues('varianceRatioTest', b, 2, 'of sample b');
  const va = sampleVariance(a);
  const vb = sampleVariance(b);
  if (va === 0 || vb === 0) throw new StatsError('varianceRatioTest requires some variation in both samples');
  const statistic = va / vb;
  const da = a.length - 1;
  const db = b.length - 1;
  const upper = fUpperTail(statistic, da, db);
  const lower = fUpperTail(1 / statistic, db, da);
  return {
    kind: 'varianceRatioTest',
    statistic,
    dfNumerator: da,
    dfDenominator: db,
    pValue: Math.min(1, 2 * Math.min(upper, lower)),
  };
}
