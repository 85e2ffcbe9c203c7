import type { ComparisonGroupData } from './types';

/** One run as a comparison sees it: its stored per-run profile. */
export interface ComparedRun {
  targetLoadN: number;
  finalLoadsN: number[];
  /** Drift % per position (null where the stud was never tightened); empty when not read. */
  driftPercent: (number | null)[];
  /** The operator (the trainee as a block); absent when unknown. */
  operator?: string | number;
  /** The operator's n-th complete run (1-based), when known. */
  attempt?: number | null;
  /**
   * The run's stored figures (runs.final_mean_n, final_sd_n: `storedRunFigures`, the same mean and
   * sample SD of `finalLoadsN`), so a comparison of thousands of runs need not recompute them.
   */
  stored?: { meanN: number; sdN: number } | null;
  /** Mean % of final load lost by the last hold reading after the last pass; null or absent without such a hold. */
  relaxationPercent?: number | null;
  /** Average gasket stress after the final step (MPa) and the joint's minimum seating stress as recorded; null or absent without gasket data. */
  gasket?: { stressMpa: number; minSeatingMpa: number | null } | null;
}

export interface GroupInput {
  key: string;
  label: string;
  runs: ComparedRun[];
}

/** A value with its interval. */
export interface Estimate {
  value: number;
  lower: number;
  upper: number;
}

export interface GroupSummary {
  key: string;
  label: string;
  colourIndex: number;
  runs: number;
  studs: number;
  /** Mean of the run means, % of target. */
  meanPercent: number | null;
  /** Geometric mean of the runs' own CVs (fraction): exp(mean ln CV). */
  geometricMeanRunCv: number | null;
  /** Mean of the runs' own CVs (fraction). */
  meanRunCv: number | null;
  /** Mean within-run SD, % of target. */
  meanWithinSdPercent: number | null;
  /** Stud-to-stud and run-to-run SDs (% of target) with 95 % intervals, from the variance components. */
  components: { withinRunSd: Estimate; betweenRunSd: Estimate; withinMethod: string; betweenMethod: string } | null;
  /** Mean relaxation (% of final load lost during the hold after the last pass) over the runs that have one, and how many do. */
  meanRelaxationPercent: number | null;
  runsWithHold: number;
  /** Gasket stress over the runs with gasket data (lib/analysis/group-gasket.ts); absent in comparisons saved before it. */
  gasket?: GroupGasketFigures;
}

/** Mean average gasket stress after the final step (MPa) and the share of runs whose average reaches the seating stress. */
export interface GroupGasketFigures {
  /** Null when no run of the group has gasket data. */
  meanStressMpa: number | null;
  runsWithGasket: number;
  /** Fraction of the runs with a known seating stress whose average reaches it; null when none has one. */
  seatedShare: number | null;
  runsWithSeating: number;
}

/** The tests a comparison runs; one of them is chosen as planned before the data is seen. */
export const COMPARISON_TESTS = ['welch-ln-cv', 'anova-ln-cv', 'welch-within-sd', 'anova-within-sd', 'spread-of-run-means', 'trainee-blocks', 'welch-relaxation'] as const;
export type ComparisonTestId = (typeof COMPARISON_TESTS)[number];

/** What each test answers, in words (also the labels of the planned-outcome choice). */
export const TEST_QUESTIONS: Record<ComparisonTestId, string> = {
  'welch-ln-cv': 'Is the run CV different? (Welch, unequal variances)',
  'anova-ln-cv': 'Is the run CV different? (one-way ANOVA, equal variances)',
  'welch-within-sd': 'Is the within-run SD different? (Welch)',
  'anova-within-sd': 'Is the within-run SD different? (one-way ANOVA)',
  'spread-of-run-means': 'Do run means (% of target) vary more from run to run in some groups?',
  'trainee-blocks': 'Is the run CV different once each operator is a block?',
  'welch-relaxation': 'Is the relaxation during the hold (% of final load lost) different? (Welch)',
};

export interface EffectSize {
  /** What the effect compares, in words ("Group A ÷ Group B, run CV"). */
  label: string;
  estimate: number;
  lower: number;
  upper: number;
  /** 'ratio' (1 = no difference) or 'points' (percentage points, 0 = no difference). */
  scale: 'ratio' | 'points';
}

export interface ComparisonTest {
  id: ComparisonTestId;
  question: string;
  name: string;
  statistic: number;
  pValue: number;
  /** Holm-adjusted across the tests of this comparison. */
  adjustedPValue: number;
  df: string;
  reading: string;
  /** True for the one outcome chosen before the data was seen; the rest are exploratory. */
  planned: boolean;
  effect: EffectSize | null;
}

export interface PairComparison {
  a: string;
  b: string;
  /** Ratio of geometric-mean run CVs a ÷ b with its family-wise 95 % interval. */
  ratio: number;
  lower: number;
  upper: number;
  pValue: number;
}

export interface TraineeBlocks {
  /** Run CV of each group relative to the first (ratio, Wald 95 % interval from the REML fit); the first is 1. */
  estimates: { key: string; label: string; ratio: number; lower: number; upper: number }[];
  /** Change of run CV per further attempt (ratio), when attempts are known and vary. */
  perAttempt: Estimate | null;
  operators: number;
  runs: number;
  /** SD of the operators' own levels and of runs around them, on ln CV. */
  operatorSd: number;
  residualSd: number;
}

export interface Planner {
  /** Pooled within-group SD of ln run CV from the runs in this selection. */
  sdLogCv: number;
  df: number;
}

export interface ComparisonResult {
  groups: GroupSummary[];
  chartGroups: ComparisonGroupData[];
  tests: ComparisonTest[];
  /** Pairs on ln run CV: Games–Howell (unequal variances) and Tukey–Kramer. */
  pairs: { gamesHowell: PairComparison[]; tukeyKramer: PairComparison[] };
  traineeBlocks: TraineeBlocks | null;
  planner: Planner | null;
  planned: ComparisonTestId;
  /** The stud counts in the selection; drift by position is drawn only when there is one. */
  studCounts: number[];
  /** Sentences about groups too small for a test to mean much, or tests that could not run. */
  warnings: string[];
}
