import { sum } from 'simple-statistics';
import { StatsError } from './stats-error';
import { assertGroups } from './internal/assert-groups';
import { sumOfSquaresAbout } from './internal/sum-of-squares-about';
import { fUpperTail } from './f-upper-tail';
import { mean } from './mean';

/** Result of {@link oneWayAnova}. */
export interface OneWayAnovaResult {
  kind: 'oneWayAnova';
  groupCount: number;
  n: number;
  dfBetween: number;
  dfWithin: number;
  ssBetween: number;
  ssWithin: number;
  msBetween: number;
  msWithin: number;
  /** F = MS between / MS within. */
  statistic: number;
  pValue: number;
  rSquared: number;
  residualSd: number;
  groupMeans: number[];
}

/**
 * One-way analysis of variance (fixed effects, equal variances assumed): does the mean differ
 * between groups (for example final loads of runs tightened by different methods)?
 *
 * Algorithm: all data are first shifted by one data value c (the first value of the first group).
 * For the NIST SmLs sets (1e12 + small) this subtraction is exact (Sterbenz lemma) and leaves
 * small numbers; group means use the refined `mean`; SS within is the sum of corrected two-pass
 * sums of squares about each group mean; SS between = Σ nᵢ(ȳᵢ − ȳ)²; compensated sums throughout.
 * p from the F upper tail (`fUpperTail`). R² = SSB/(SSB + SSW), residual SD = √MSW.
 *
 * References: NIST StRD Analysis of Variance (certified df, SS, MS, F, R², residual SD);
 * NIST/SEMATECH e-Handbook §7.4.3 (one-way ANOVA); Chan, Golub & LeVeque (1983).
 *
 * @throws {StatsError} `oneWayAnova requires at least two groups`,
 *   `oneWayAnova requires at least one value of group 2`, non-finite values,
 *   `oneWayAnova requires more values than groups`, `oneWayAnova requires some variation within groups`.
 * @example
 * oneWayAnova([[1, 2, 3], [4, 5, 6]]).statistic; // 13.5 (hand: SSB = 13.5, SSW = 4, df 1 and 4)
 */
export function oneWayAnova(groups: readonly (readonly number[])[]): OneWayAnovaResult {
  assertGroups('oneWayAnova', groups, 2, 1);
  const k = groups.length;
  const n = groups.reduce((acc, g) => acc + g.length, 0);
  if (n <= k) throw new StatsError('oneWayAnova requires more values than groups');
  const shift = groups[0]![0]!;
  const shifted = groups.map((g) => g.map((v) => v - shift));
  const means = shifted.map((g) => mean(g));
  // concat, not flat(): the same values in the same order, and flat() costs about 150 times as much in V8.
  const grand = mean(([] as number[]).concat(...shifted));
  const ssWithin = sum(shifted.map((g, i) => sumOfSquaresAbout(g, means[i]!)));
  const ssBetween = sum(shifted.map((g, i) => g.length * (means[i]! - grand) ** 2));
  const dfBetween = k - 1;
  const dfWithin = n - k;
  const msBetween = ssBetween / dfBetween;
  const msWithin = ssWithin / dfWithin;
  if (msWithin === 0) throw new StatsError('oneWayAnova requires some variation within groups');
  const statistic = msBetween / msWithin;
  return {
    kind: 'oneWayAnova',
    groupCount: k,
    n,
    dfBetween,
    dfWithin,
    ssBetween,
    ssWithin,
    msBetween,
    msWithin,
    statistic,
    pValue: fUpperTail(statistic, dfBetween, dfWithin),
    rSquared: ssBetween / (ssBetween + ssWithin),
    residualSd: Math.sqrt(msWithin),
    groupMeans: means.map((m) => m + shift),
  };
}
