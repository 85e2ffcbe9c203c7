import { assertGroups } from './internal/assert-groups';
import { assertNumber } from './internal/assert-number';
import { StatsError } from './stats-error';
import { mean } from './mean';
import { sampleVariance } from './sample-variance';
import { studentizedRangeQuantile } from './studentized-range-quantile';
import { studentizedRangeUpperTail } from './studentized-range-upper-tail';

/** One pair in a {@link GamesHowellResult}. Groups are numbered from 0 in input order. */
export interface GamesHowellComparison {
  groupA: number;
  groupB: number;
  /** ȳa − ȳb. */
  meanDifference: number;
  /** √(sa²/na + sb²/nb), the Welch standard error of the difference. */
  standardError: number;
  /** Welch–Satterthwaite degrees of freedom of this pair. */
  df: number;
  /** Studentized range statistic q = |ȳa − ȳb| / √((sa²/na + sb²/nb)/2). */
  statistic: number;
  /** Family-wise adjusted p-value, P(Q(k, df) > q). */
  pValue: number;
  confidenceInterval: { lower: number; upper: number };
}

/** Result of {@link gamesHowell}. */
export interface GamesHowellResult {
  kind: 'gamesHowell';
  groupCount: number;
  confidence: number;
  comparisons: GamesHowellComparison[];
}

/**
 * Games–Howell pairwise comparisons of group means without assuming equal variances or sizes (the
 * companion of Welch's ANOVA, as Tukey–Kramer is of the one-way ANOVA).
 *
 * Algorithm: for each pair, vₐ = sₐ²/nₐ, v_b = s_b²/n_b, SE = √(vₐ + v_b),
 * ν = (vₐ + v_b)²/[vₐ²/(nₐ − 1) + v_b²/(n_b − 1)] (Welch–Satterthwaite),
 * q = |ȳa − ȳb|/√((vₐ + v_b)/2), p = P(Q > q) for k means and ν (`studentizedRangeUpperTail`),
 * interval ȳa − ȳb ± q₁₋α(k, ν)·SE/√2 (`studentizedRangeQuantile`).
 *
 * References: Games & Howell, "Pairwise multiple comparison procedures with unequal n's and/or
 * variances: a Monte Carlo study", Journal of Educational Statistics 1 (1976) 113–125 (the procedure);
 * test reference: the same formula evaluated with scipy.stats.studentized_range in
 * scripts/generate-multiple-comparison-fixtures.py.
 *
 * @throws {StatsError} `gamesHowell requires at least two groups`,
 *   `gamesHowell requires at least three values of group 2 (got 2)` (so ν ≥ 2), non-finite values,
 *   `gamesHowell requires some variation in group 1 or group 2`.
 * @example
 * gamesHowell([[1, 2, 3], [4, 5, 6]]).comparisons[0]?.statistic; // 5.196152422706632 (= 3/√((1/3 + 1/3)/2))
 */
export function gamesHowell(groups: readonly (readonly number[])[], options: { confidence?: number } = {}): GamesHowellResult {
  assertGroups('gamesHowell', groups, 2, 3);
  const confidence = options.confidence ?? 0.95;
  assertNumber('gamesHowell', 'confidence', confidence, 'probability');
  const k = groups.length;
  const means = groups.map((g) => mean(g));
  const v = groups.map((g) => sampleVariance(g) / g.length);
  const comparisons: GamesHowellComparison[] = [];
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k; b++) {
      const sum = v[a]! + v[b]!;
      if (sum === 0) throw new StatsError(`gamesHowell requires some variation in group ${a + 1} or group ${b + 1}`);
      const df = sum ** 2 / (v[a]! ** 2 / (groups[a]!.length - 1) + v[b]! ** 2 / (groups[b]!.length - 1));
      const meanDifference = means[a]! - means[b]!;
      const standardError = Math.sqrt(sum);
      const statistic = Math.abs(meanDifference) / (standardError / Math.SQRT2);
      const half = (studentizedRangeQuantile(confidence, k, df) * standardError) / Math.SQRT2;
      comparisons.push({
        groupA: a,
        groupB: b,
        meanDifference,
        standardError,
        df,
        statistic,
        pValue: studentizedRangeUpperTail(statistic, k, df),
        confidenceInterval: { lower: meanDifference - half, upper: meanDifference + half },
      });
    }
  }
  return { kind: 'gamesHowell', groupCount: k, confidence, comparisons };
}
