import { assertGroups } from './internal/assert-groups';
import { assertNumber } from './internal/assert-number';
import { StatsError } from './stats-error';
import { oneWayAnova } from './one-way-anova';
import { studentizedRangeQuantile } from './studentized-range-quantile';
import { studentizedRangeUpperTail } from './studentized-range-upper-tail';

/** One pair in a {@link TukeyHsdResult}. Groups are numbered from 0 in input order. */
export interface TukeyHsdComparison {
  groupA: number;
  groupB: number;
  /** ȳa − ȳb. */
  meanDifference: number;
  standardError: number;
  /** Studentized range statistic q = |ȳa − ȳb| / SE. */
  statistic: number;
  /** Family-wise adjusted p-value. */
  pValue: number;
  confidenceInterval: { lower: number; upper: number };
}

/** Result of {@link tukeyHsd}. */
export interface TukeyHsdResult {
  kind: 'tukeyHsd';
  groupCount: number;
  dfWithin: number;
  msWithin: number;
  confidence: number;
  criticalValue: number;
  comparisons: TukeyHsdComparison[];
}

/**
 * Tukey's honestly significant difference for all pairs of group means, in the Tukey–Kramer form
 * for unequal group sizes: which methods differ, with the family-wise error held at α.
 *
 * Algorithm: MSW and dfW from `oneWayAnova`; for each pair SE = √(MSW/2 · (1/na + 1/nb)),
 * q = |ȳa − ȳb|/SE, p = P(Q > q) for k means and dfW (`studentizedRangeUpperTail`, jstat's port of
 * R's ptukey); interval ȳa − ȳb ± q₁₋α·SE with q₁₋α from `studentizedRangeQuantile`.
 *
 * References: Tukey (1953, unpublished; see Hochberg & Tamhane, Multiple Comparison Procedures,
 * 1987); Kramer, Biometrics 12 (1956) 307–310; NIST/SEMATECH e-Handbook §7.4.7.1;
 * scipy.stats.tukey_hsd (test reference).
 *
 * @throws {StatsError} `tukeyHsd requires at least two groups`, empty groups, non-finite values,
 *   `tukeyHsd requires at least two error degrees of freedom`, or as `oneWayAnova`.
 * @example
 * tukeyHsd([[1, 2, 3], [4, 5, 6], [7, 8, 9]]).comparisons[0]?.statistic; // 5.196152422706632 (= 3/√(1/3))
 */
export function tukeyHsd(groups: readonly (readonly number[])[], options: { confidence?: number } = {}): TukeyHsdResult {
  assertGroups('tukeyHsd', groups, 2, 1);
  const confidence = options.confidence ?? 0.95;
  assertNumber('tukeyHsd', 'confidence', confidence, 'probability');
  const anova = oneWayAnova(groups);
  if (anova.dfWithin < 2) throw new StatsError('tukeyHsd requires at least two error degrees of freedom');
  const k = groups.length;
  const criticalValue = studentizedRangeQuantile(confidence, k, anova.dfWithin);
  const comparisons: TukeyHsdComparison[] = [];
  for (let a = 0; a < k; a++) {
    for (let b = a + 1; b < k; b++) {
      const na = groups[a]!.length;
      const nb = groups[b]!.length;
      const meanDifference = anova.groupMeans[a]! - anova.groupMeans[b]!;
      const standardError = Math.sqrt((anova.msWithin / 2) * (1 / na + 1 / nb));
      const statistic = Math.abs(meanDifference) / standardError;
      comparisons.push({
        groupA: a,
        groupB: b,
        meanDifference,
        standardError,
        statistic,
        pValue: studentizedRangeUpperTail(statistic, k, anova.dfWithin),
        confidenceInterval: {
          lower: meanDifference - criticalValue * standardError,
          upper: meanDifference + criticalValue * standardError,
        },
      });
    }
  }
  return { kind: 'tukeyHsd', groupCount: k, dfWithin: anova.dfWithin, msWithin: anova.msWithin, confidence, criticalValue, comparisons };
}
