import { StatsError } from './stats-error';
import { assertValues } from './internal/assert-values';
import { welchTTest } from './welch-t-test';

/** Result of {@link cvRatioFromLogCv}. */
export interface CvRatioResult {
  kind: 'cvRatioFromLogCv';
  /** exp(mean ln CV_a − mean ln CV_b): the ratio of the groups' geometric-mean run CVs. */
  ratio: number;
  lower: number;
  upper: number;
  confidence: number;
  /** Welch–Satterthwaite degrees of freedom of the log-scale interval. */
  df: number;
  /** Two-sided Welch p-value for equal mean log CV. */
  pValue: number;
  /** The log-scale difference and its standard error. */
  logDifference: number;
  standardError: number;
}

/**
 * Effect size for scatter: how many times larger group a's run CV is than group b's, with its
 * interval. Each run is one value (its CV), so runs, not studs, are the unit.
 *
 * Algorithm: Welch's t interval (`welchTTest`) for the difference of mean ln CV, exponentiated:
 * ratio = exp(d̄), interval [exp(d̄ − t·SE), exp(d̄ + t·SE)]. The ratio is that of geometric mean
 * CVs (the median ratio when ln CV is normal). Log scale because CVs are positive and right-skewed,
 * and a ratio is symmetric on it.
 *
 * References: Welch, Biometrika 34 (1947) 28–35; Bland & Altman, "Transforming data", BMJ 312
 * (1996) 770 (back-transformed differences of logs are ratios of geometric means); test reference
 * scipy.stats.ttest_ind(equal_var=False).confidence_interval on ln CV, exponentiated.
 *
 * @throws {StatsError} fewer than two runs in a group, non-finite values,
 *   `cvRatioFromLogCv requires positive CVs (got 0 at index 2 of group a)`, or as `welchTTest`.
 * @example
 * cvRatioFromLogCv([0.02, 0.03, 0.025], [0.01, 0.012, 0.011]).ratio; // 2.248221565113046 (= exp(mean ln a − mean ln b), by hand in node)
 */
export function cvRatioFromLogCv(
  groupA: readonly number[],
  groupB: readonly number[],
  options: { confidence?: number } = {},
): CvRatioResult {
  const fn = 'cvRatioFromLogCv';
  const logs = ([values, label]: [readonly number[], string]): number[] => {
    assertValues(fn, values, 2, `of group ${label}`);
    values.forEach((v, i) => {
      if (!(v > 0)) throw new StatsError(`${fn} requires positive CVs (got ${v} at index ${i} of group ${label})`);
    });
    return values.map((v) => Math.log(v));
  };
  const t = welchTTest(logs([groupA, 'a']), logs([groupB, 'b']), options);
  return {
    kind: fn,
    ratio: Math.exp(t.meanDifference),
    lower: Math.exp(t.confidenceInterval.lower),
    upper: Math.exp(t.confidenceInterval.upper),
    confidence: t.confidenceInterval.confidence,
    df: t.df,
    pValue: t.pValue,
    logDifference: t.meanDifference,
    standardError: t.standardError,
  };
}
