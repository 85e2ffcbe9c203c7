import type { BoxStats as BoxSummary } from '../charts/box-stats';

/**
 * The computed figures of one run as the run report, the classroom and the charts receive them
 * (plain objects, safe to send to the client). Loads in newtons; percentages as numbers (5 = 5 %);
 * CV as a fraction (0.05 = 5 %).
 */
export interface AnalysedStep {
  order: number;
  pass: number;
  /** Position of the stud tightened in this step (the first, when the step covered several). */
  position: number;
  /** Every stud a multi-stud (tensioner) step tightened; absent for a one-stud step. */
  positions?: number[];
  /** Every stud's load right after this step (index 0 = position 1). */
  loadsN: number[];
  timeS: number | null;
  appliedTorqueNm: number | null;
}

export interface PassSummary {
  pass: number;
  /** The method's % of target for this pass, when known. */
  percentOfTarget: number | null;
  /** Every stud's load at the end of the pass. */
  loadsAfterN: number[];
  /** Mean change, over the studs tightened in this pass, from right after tightening to the end of the pass, in %. */
  meanLossPercent: number;
  cv: number;
}

export interface StudDrift {
  position: number;
  /** Load right after the stud was last tightened. */
  afterLastTighteningN: number;
  finalN: number;
  /** (final − after) / after × 100; negative = lost load as neighbours were pulled up. */
  driftPercent: number;
}

export interface ReachEstimate {
  /** Circular distance k (1 = next stud). */
  distance: number;
  /** Change of a stud's load as a fraction of the load added to a stud k positions away (negative = relaxes). */
  coefficient: number;
  standardError: number;
  observations: number;
}

export interface RunFigures {
  meanN: number;
  sdN: number;
  cv: number;
  rangeOverMean: number;
  /** Largest absolute deviation of a final load from target, in % of target. */
  largestDeviationPercent: number;
  /** Share (0..1) of studs whose final load lies within target ± band. */
  shareWithinBand: number;
  cp: number | null;
  cpk: number | null;
}

export interface RunAnalysis {
  runId: number;
  studCount: number;
  targetLoadN: number;
  bandPercent: number;
  finalLoadsN: number[];
  steps: AnalysedStep[];
  passes: PassSummary[];
  drift: StudDrift[];
  reach: ReachEstimate[];
  figures: RunFigures;
}

/** A box-and-whisker summary (R-7 quartiles, whiskers at 1.5 IQR): the chart layer's BoxStats. */
export type { BoxStats as BoxSummary } from '../charts/box-stats';

/** One group of a comparison (a method, lubricant, cohort, trainee or a hand-picked set). */
export interface ComparisonGroupData {
  key: string;
  label: string;
  /** A stable colour slot (0..7) so a group keeps its colour across the charts of one comparison. */
  colourIndex: number;
  /** Final stud loads as % of each run's target: all of them, or an even sample for large groups. */
  finalLoadsPercent: number[];
  /** One CV (fraction) per run: all of them, or an even sample for large groups. */
  runCvs: number[];
  /** Box of all final loads (% of target) when `finalLoadsPercent` is a sample. */
  finalLoadsBox?: BoxSummary;
  /** Box of all run CVs, in %, when `runCvs` is a sample. */
  runCvBox?: BoxSummary;
  /** Mean drift (%) by position for runs with that stud count (index 0 = position 1). */
  meanDriftByPosition: number[];
}
