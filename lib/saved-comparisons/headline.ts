/**
 * The headline numbers of a frozen comparison: what the data package's Python script recomputes and
 * a reviewer checks. Taken from the results as shown, never recomputed. Pure and browser-safe.
 */
import type { ComparisonResult } from '../analysis/compare-types';

export interface HeadlineTest {
  statistic: number;
  pValue: number;
}

export interface HeadlineGroup {
  key: string;
  label: string;
  meanLnCv: number;
  meanGasketStressMpa: number | null;
  seatedShare: number | null;
}

export interface Headline {
  /**
   * Per group: the mean of ln run CV (ln of the typical run CV shown), the mean average gasket stress
   * after the final step (MPa) and the share of runs reaching the seating stress, as the groups table
   * shows them (null without gasket data, and in comparisons frozen before gasket figures).
   */
  groups: HeadlineGroup[];
  /** Welch's ANOVA and the one-way ANOVA on ln run CV (F and p). */
  welchLnCv: HeadlineTest | null;
  anovaLnCv: HeadlineTest | null;
  /** The ratio of run CVs between the two groups furthest apart, with its 95 % interval. */
  cvRatio: { label: string; ratio: number; lower: number; upper: number } | null;
}

function testOf(result: Pick<ComparisonResult, 'tests'>, id: 'welch-ln-cv' | 'anova-ln-cv'): HeadlineTest | null {
  const test = result.tests.find((t) => t.id === id);
  return test ? { statistic: test.statistic, pValue: test.pValue } : null;
}

export function headlineOf(result: Pick<ComparisonResult, 'groups' | 'tests'>): Headline {
  const effect = result.tests.find((t) => t.id === 'welch-ln-cv')?.effect ?? null;
  return {
    groups: result.groups
      .filter((g) => g.geometricMeanRunCv !== null)
      .map((g) => ({ key: g.key, label: g.label, meanLnCv: Math.log(g.geometricMeanRunCv!), meanGasketStressMpa: g.gasket?.meanStressMpa ?? null, seatedShare: g.gasket?.seatedShare ?? null })),
    welchLnCv: testOf(result, 'welch-ln-cv'),
    anovaLnCv: testOf(result, 'anova-ln-cv'),
    cvRatio: effect ? { label: effect.label, ratio: effect.estimate, lower: effect.lower, upper: effect.upper } : null,
  };
}
