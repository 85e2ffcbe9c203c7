import type { BartlettTestResult } from './bartlett-test';
import type { CvConfidenceIntervalResult } from './cv-confidence-interval';
import type { LeveneTypeResult } from './levene-test';
import type { NutFactorResult } from './nut-factor';
import type { OneWayAnovaResult } from './one-way-anova';
import type { TukeyHsdResult } from './tukey-hsd';
import type { VarianceRatioTestResult } from './variance-ratio-test';
import type { WelchAnovaResult } from './welch-anova';
import type { WelchTTestResult } from './welch-t-test';
import { assertNumber } from './internal/assert-number';
import { StatsError } from './stats-error';

/** Every result kind that {@link readStatisticalResult} can read. */
export type ReadableResult =
  | OneWayAnovaResult
  | WelchAnovaResult
  | WelchTTestResult
  | LeveneTypeResult
  | BartlettTestResult
  | VarianceRatioTestResult
  | TukeyHsdResult
  | CvConfidenceIntervalResult
  | NutFactorResult;

/** Options for {@link readStatisticalResult}. */
export interface ReadingOptions {
  /** Significance level, default 0.05. */
  alpha?: number;
  /** What is being compared, default 'these groups' (for example 'these methods'). */
  subject?: string;
  /** Group names for Tukey pairs, in input order; default 'group 1', 'group 2', … */
  groupLabels?: readonly string[];
  /** What the means are of, for the tests of means, default 'mean load' (for example 'mean run CV'). */
  measure?: string;
}

const capitalise = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1);
const formatP = (p: number): string => {
  if (p < 0.001) return 'p < 0.001';
  return `p = ${Number(p.toPrecision(2))}`;
};
const formatStat = (x: number): string => (Math.abs(x) >= 1000 ? x.toPrecision(4) : x.toFixed(2));
const formatDf = (df: number): string => (Number.isInteger(df) ? String(df) : df.toFixed(1));
const formatPercent = (ratio: number): string => (Number.isFinite(ratio) ? `${(ratio * 100).toFixed(1)} %` : 'unbounded');

/**
 * The plain-language "reading" of a statistical result for the UI: one sentence that says what
 * the result means at the chosen level and gives the statistic in brackets, for example
 * "Scatter differs between these methods at the 5 % level (Levene W = 4.12, p = 0.003)." or
 * "No evidence at the 5 % level that scatter differs between these methods (Bartlett T = 3.10, p = 0.21)."
 * A non-significant result is never read as "the same": it is "no evidence that … differs".
 *
 * Algorithm: switch on `result.kind`; p-values below 0.001 are written "p < 0.001", others with
 * two significant digits; statistics with two decimals.
 *
 * References: NIST/SEMATECH e-Handbook §1.3.5 (interpreting hypothesis tests); wording is our own.
 *
 * @throws {StatsError} `readStatisticalResult requires a known result kind (got 'x')`, or an alpha outside (0, 1).
 * @example
 * readStatisticalResult(leveneTest(groups), { subject: 'these methods' });
 * // 'Scatter differs between these methods at the 5 % level (Levene W = 4.12, p = 0.003).'
 */
export function readStatisticalResult(result: ReadableResult, options: ReadingOptions = {}): string {
  const alpha = options.alpha ?? 0.05;
  assertNumber('readStatisticalResult', 'alpha', alpha, 'probability');
  const subject = options.subject ?? 'these groups';
  const level = `the ${Number((alpha * 100).toPrecision(3))} % level`;
  const verdict = (p: number, measure: string, between: string, bracket: string): string =>
    p < alpha
      ? `${measure[0]!.toUpperCase()}${measure.slice(1)} differs between ${between} at ${level} (${bracket}).`
      : `No evidence at ${level} that ${measure} differs between ${between} (${bracket}).`;
  const label = (i: number): string => options.groupLabels?.[i] ?? `group ${i + 1}`;

  switch (result.kind) {
    case 'oneWayAnova':
      return verdict(
        result.pValue,
        options.measure ?? 'mean load',
        subject,
        `one-way ANOVA F(${result.dfBetween}, ${result.dfWithin}) = ${formatStat(result.statistic)}, ${formatP(result.pValue)}`,
      );
    case 'welchAnova':
      return verdict(
        result.pValue,
        options.measure ?? 'mean load',
        subject,
        `Welch's ANOVA F(${formatDf(result.dfBetween)}, ${formatDf(result.dfWithin)}) = ${formatStat(result.statistic)}, ${formatP(result.pValue)}`,
      );
    case 'welchTTest':
      return verdict(
        result.pValue,
        options.measure ?? 'mean load',
        options.subject ?? 'the two groups',
        `Welch t(${formatDf(result.df)}) = ${formatStat(result.statistic)}, ${formatP(result.pValue)}`,
      );
    case 'leveneTest':
      return verdict(result.pValue, 'scatter', subject, `Levene W = ${formatStat(result.statistic)}, ${formatP(result.pValue)}`);
    case 'brownForsytheTest':
      return verdict(
        result.pValue,
        'scatter',
        subject,
        `Brown–Forsythe W = ${formatStat(result.statistic)}, ${formatP(result.pValue)}`,
      );
    case 'bartlettTest':
      return verdict(result.pValue, 'scatter', subject, `Bartlett T = ${formatStat(result.statistic)}, ${formatP(result.pValue)}`);
    case 'varianceRatioTest':
      return verdict(
        result.pValue,
        'scatter',
        options.subject ?? 'the two groups',
        `F(${result.dfNumerator}, ${result.dfDenominator}) = ${formatStat(result.statistic)}, ${formatP(result.pValue)}`,
      );
    case 'tukeyHsd': {
      const significant = result.comparisons.filter((c) => c.pValue < alpha);
      const total = result.comparisons.length;
      if (significant.length === 0) {
        const smallest = Math.min(...result.comparisons.map((c) => c.pValue));
        return `No pair of ${subject} differs in mean load at ${level} (Tukey HSD, smallest ${formatP(smallest)}).`;
      }
      const pairs = significant.map((c) => `${label(c.groupA)} vs ${label(c.groupB)} (${formatP(c.pValue)})`).join(', ');
      return `${capitalise(options.measure ?? 'mean load')} differs at ${level} for ${significant.length} of ${total} pair${total === 1 ? '' : 's'} of ${subject} (Tukey HSD): ${pairs}.`;
    }
    case 'cvConfidenceInterval':
      return `The CV is ${formatPercent(result.cv)} (${Number((result.confidence * 100).toPrecision(3))} % confidence interval ${formatPercent(result.lower)} to ${formatPercent(result.upper)}, Vangel's modified McKay method, n = ${result.n}).`;
    case 'nutFactor':
      return `The fitted nut factor is K = ${result.fitted.toFixed(3)} (${Number((result.confidenceInterval.confidence * 100).toPrecision(3))} % confidence interval ${result.confidenceInterval.lower.toFixed(3)} to ${result.confidenceInterval.upper.toFixed(3)}, n = ${result.n}, short-form T = K·D·F).`;
    default: {
      const kind = (result as { kind?: unknown }).kind;
      throw new StatsError(`readStatisticalResult requires a known result kind (got '${String(kind)}')`);
    }
  }
}
