import { bartlettTest } from '../stats/bartlett-test';
import { brownForsytheTest } from '../stats/brown-forsythe-test';
import { cvConfidenceInterval } from '../stats/cv-confidence-interval';
import { leveneTest } from '../stats/levene-test';
import { mean } from '../stats/mean';
import { oneWayAnova } from '../stats/one-way-anova';
import { readStatisticalResult } from '../stats/read-statistical-result';
import { sampleStandardDeviation } from '../stats/sample-standard-deviation';
import { tukeyHsd } from '../stats/tukey-hsd';
import { welchAnova } from '../stats/welch-anova';
import { boxStats } from '../charts/box-stats';
import type { BoxSummary, ComparisonGroupData } from './types';
import { formatDecimals } from '@/lib/calc/units';

/** One run as a comparison sees it: its stored per-run profile. */
export interface ComparedRun {
  targetLoadN: number;
  finalLoadsN: number[];
  /** Drift % per position (null where the stud was never tightened). */
  driftPercent: (number | null)[];
}

export interface GroupInput {
  key: string;
  label: string;
  runs: ComparedRun[];
}

export interface GroupSummary {
  key: string;
  label: string;
  colourIndex: number;
  runs: number;
  studs: number;
  /** Pooled final loads as % of target. */
  meanPercent: number | null;
  sdPercent: number | null;
  cv: number | null;
  cvInterval: { lower: number; upper: number; confidence: number } | null;
  /** Mean of the runs' own CVs. */
  meanRunCv: number | null;
}

export interface ComparisonTest {
  /** Which question the test answers, in words. */
  question: string;
  name: string;
  statistic: number;
  pValue: number;
  df: string;
  reading: string;
}

export interface PairComparison {
  a: string;
  b: string;
  difference: number;
  pValue: number;
  lower: number;
  upper: number;
}

export interface ComparisonResult {
  groups: GroupSummary[];
  chartGroups: ComparisonGroupData[];
  tests: ComparisonTest[];
  pairs: PairComparison[];
  /** Sentences about groups too small for a test to mean much, or tests that could not run. */
  warnings: string[];
}

/** Dots drawn per group at most; larger groups are drawn from an even sample, with the box from all values. */
export const MAX_DOTS_PER_GROUP = 400;

/** An even, deterministic sample (every k-th value) of at most `max` values. */
export function evenSample(values: readonly number[], max: number): number[] {
  if (values.length <= max) return values.slice();
  const step = values.length / max;
  return Array.from({ length: max }, (_, i) => values[Math.floor(i * step)]!);
}

function boxOf(values: readonly number[]): BoxSummary | undefined {
  const box = boxStats(values);
  if (!box) return undefined;
  return { ...box, outliers: evenSample(box.outliers, MAX_DOTS_PER_GROUP) };
}

/** Fewer runs than this in a group make the tests say little (common practice: a handful per group at least). */
export const SMALL_GROUP_RUNS = 5;

const safeMean = (values: number[]) => (values.length ? mean(values) : null);
const safeSd = (values: number[]) => (values.length > 1 ? sampleStandardDeviation(values) : null);

function runCv(run: ComparedRun): number | null {
  if (run.finalLoadsN.length < 2) return null;
  const m = mean(run.finalLoadsN);
  return m > 0 ? sampleStandardDeviation(run.finalLoadsN) / m : null;
}

/**
 * Compares groups of runs: per-group summaries of the pooled final loads (% of target) with a CI
 * for the CV (Vangel's modified McKay), and the tests that fit the question:
 * - Is the scatter of the final loads different? Levene (mean-centred), Brown–Forsythe (median-
 *   centred) and Bartlett, on the pooled final loads as % of target.
 * - Is the run CV different? One-way ANOVA and Welch's ANOVA on the runs' CVs (the run is the
 *   independent unit), with Tukey–Kramer pairs.
 * Each test carries its reading in plain words. `subject` names the groups ("these methods").
 */
export function compareGroups(inputs: GroupInput[], options: { subject: string; alpha?: number }): ComparisonResult {
  const warnings: string[] = [];
  const groups: GroupSummary[] = [];
  const chartGroups: ComparisonGroupData[] = [];
  const allLoads: number[][] = [];
  const allCvs: number[][] = [];
  inputs.forEach((input, index) => {
    const loadsPercent = input.runs.flatMap((run) => run.finalLoadsN.map((load) => (load / run.targetLoadN) * 100));
    const cvs = input.runs.map(runCv).filter((cv): cv is number => cv !== null);
    const m = safeMean(loadsPercent);
    const sd = safeSd(loadsPercent);
    let cvInterval: GroupSummary['cvInterval'] = null;
    if (loadsPercent.length >= 2 && sd !== null && sd > 0) {
      const ci = cvConfidenceInterval(loadsPercent, { confidence: 0.95 });
      cvInterval = { lower: ci.lower, upper: ci.upper, confidence: ci.confidence };
    }
    groups.push({ key: input.key, label: input.label, colourIndex: index % 8, runs: input.runs.length, studs: loadsPercent.length, meanPercent: m, sdPercent: sd, cv: m && sd !== null ? sd / m : null, cvInterval, meanRunCv: safeMean(cvs) });
    const maxStuds = Math.max(0, ...input.runs.map((r) => r.driftPercent.length));
    const meanDriftByPosition = Array.from({ length: maxStuds }, (_, p) => {
      const values = input.runs.map((r) => r.driftPercent[p]).filter((v): v is number => typeof v === 'number');
      return values.length ? mean(values) : 0;
    });
    const large = loadsPercent.length > MAX_DOTS_PER_GROUP || cvs.length > MAX_DOTS_PER_GROUP;
    chartGroups.push({
      key: input.key,
      label: input.label,
      colourIndex: index % 8,
      finalLoadsPercent: evenSample(loadsPercent, MAX_DOTS_PER_GROUP),
      runCvs: evenSample(cvs, MAX_DOTS_PER_GROUP),
      ...(large ? { finalLoadsBox: boxOf(loadsPercent), runCvBox: boxOf(cvs.map((cv) => cv * 100)) } : {}),
      meanDriftByPosition,
    });
    allLoads.push(loadsPercent);
    allCvs.push(cvs);
    if (input.runs.length < SMALL_GROUP_RUNS) {
      warnings.push(`${input.label} has only ${input.runs.length} run${input.runs.length === 1 ? '' : 's'}: with fewer than ${SMALL_GROUP_RUNS}, the tests below say little about it.`);
    }
  });

  const tests: ComparisonTest[] = [];
  let pairs: PairComparison[] = [];
  const usable = inputs.map((input, index) => ({ input, index, loads: allLoads[index]!, cvs: allCvs[index]! }));
  const withLoads = usable.filter((u) => u.loads.length >= 2);
  const withCvs = usable.filter((u) => u.cvs.length >= 2);
  const reading = (result: Parameters<typeof readStatisticalResult>[0], measure?: string) =>
    readStatisticalResult(result, { subject: options.subject, alpha: options.alpha ?? 0.05, measure });

  const attempt = (name: string, run: () => void) => {
    try {
      run();
    } catch (error) {
      warnings.push(`${name} could not be computed: ${error instanceof Error ? error.message : String(error)}.`);
    }
  };

  if (withLoads.length >= 2) {
    const groupsOfLoads = withLoads.map((u) => u.loads);
    const scatterQuestion = 'Do the final loads scatter differently?';
    attempt("Levene's test", () => {
      const r = leveneTest(groupsOfLoads);
      tests.push({ question: scatterQuestion, name: "Levene's test (mean-centred)", statistic: r.statistic, pValue: r.pValue, df: `${r.dfBetween}, ${r.dfWithin}`, reading: reading(r) });
    });
    attempt('The Brown–Forsythe test', () => {
      const r = brownForsytheTest(groupsOfLoads);
      tests.push({ question: scatterQuestion, name: 'Brown–Forsythe test (median-centred)', statistic: r.statistic, pValue: r.pValue, df: `${r.dfBetween}, ${r.dfWithin}`, reading: reading(r) });
    });
    attempt("Bartlett's test", () => {
      const r = bartlettTest(groupsOfLoads);
      tests.push({ question: scatterQuestion, name: "Bartlett's test", statistic: r.statistic, pValue: r.pValue, df: String(r.df), reading: reading(r) });
    });
  } else {
    warnings.push('At least two groups with final loads are needed for the scatter tests.');
  }

  if (withCvs.length >= 2) {
    const groupsOfCvs = withCvs.map((u) => u.cvs);
    const labels = withCvs.map((u) => u.input.label);
    const cvQuestion = 'Is the run CV different on average?';
    attempt('The one-way ANOVA', () => {
      const r = oneWayAnova(groupsOfCvs);
      tests.push({ question: cvQuestion, name: 'One-way ANOVA of run CVs', statistic: r.statistic, pValue: r.pValue, df: `${r.dfBetween}, ${r.dfWithin}`, reading: reading(r, 'mean run CV') });
    });
    attempt("Welch's ANOVA", () => {
      const r = welchAnova(groupsOfCvs);
      tests.push({ question: cvQuestion, name: "Welch's ANOVA of run CVs", statistic: r.statistic, pValue: r.pValue, df: `${r.dfBetween}, ${formatDecimals(r.dfWithin, 1)}`, reading: reading(r, 'mean run CV') });
    });
    attempt('The Tukey–Kramer pairs', () => {
      const r = tukeyHsd(groupsOfCvs, { confidence: 0.95 });
      pairs = r.comparisons.map((c) => ({
        a: labels[c.groupA] ?? `group ${c.groupA + 1}`,
        b: labels[c.groupB] ?? `group ${c.groupB + 1}`,
        difference: c.meanDifference,
        pValue: c.pValue,
        lower: c.confidenceInterval.lower,
        upper: c.confidenceInterval.upper,
      }));
    });
  } else {
    warnings.push('At least two groups with two or more runs each are needed to compare run CVs.');
  }
  return { groups, chartGroups, tests, pairs, warnings };
}
