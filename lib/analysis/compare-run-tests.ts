import { brownForsytheTest } from '../stats/brown-forsythe-test';
import { cvRatioFromLogCv } from '../stats/cv-ratio-from-log-cv';
import { gamesHowell } from '../stats/games-howell';
import { fQuantile } from '../stats/internal/f-quantile';
import { mean } from '../stats/mean';
import { oneWayAnova } from '../stats/one-way-anova';
import { sampleVariance } from '../stats/sample-variance';
import { tukeyHsd } from '../stats/tukey-hsd';
import { welchAnova } from '../stats/welch-anova';
import { welchTTest } from '../stats/welch-t-test';
import type { ComparisonTest, EffectSize, PairComparison } from './compare-types';
import { TEST_QUESTIONS } from './compare-types';
import { formatDecimals } from '@/lib/calc/units';

/** One group's run-level values (one value per run). */
export interface RunLevelGroup {
  label: string;
  /** ln of each run's CV. */
  lnCv: number[];
  /** Each run's within-run SD, % of target. */
  withinSdPercent: number[];
  /** Each run's mean, % of target. */
  meanPercent: number[];
}

/** A test before Holm's adjustment and the planned label are added. */
export type RawTest = Omit<ComparisonTest, 'adjustedPValue' | 'planned' | 'reading'> & { measure: string };

const indexOfExtreme = (values: number[], pick: (a: number, b: number) => boolean) => values.reduce((best, v, i) => (pick(v, values[best]!) ? i : best), 0);

/** The two groups furthest apart on a measure: the one with the largest mean first. */
function extremes(groups: readonly RunLevelGroup[], values: (g: RunLevelGroup) => number[]): [RunLevelGroup, RunLevelGroup] {
  const means = groups.map((g) => mean(values(g)));
  return [groups[indexOfExtreme(means, (a, b) => a > b)]!, groups[indexOfExtreme(means, (a, b) => a < b)]!];
}

function cvRatioEffect(groups: readonly RunLevelGroup[]): EffectSize {
  const [high, low] = extremes(groups, (g) => g.lnCv);
  const r = cvRatioFromLogCv(high.lnCv.map(Math.exp), low.lnCv.map(Math.exp));
  return { label: `Run CV, ${high.label} ÷ ${low.label}`, estimate: r.ratio, lower: r.lower, upper: r.upper, scale: 'ratio' };
}

function sdDifferenceEffect(groups: readonly RunLevelGroup[]): EffectSize {
  const [high, low] = extremes(groups, (g) => g.withinSdPercent);
  const t = welchTTest(high.withinSdPercent, low.withinSdPercent);
  return { label: `Within-run SD, ${high.label} − ${low.label}`, estimate: t.meanDifference, lower: t.confidenceInterval.lower, upper: t.confidenceInterval.upper, scale: 'points' };
}

/** Ratio of the SDs of run means, largest ÷ smallest, with the F-based 95 % interval (normal theory). */
function runMeanSpreadEffect(groups: readonly RunLevelGroup[]): EffectSize {
  const variances = groups.map((g) => sampleVariance(g.meanPercent));
  const high = groups[indexOfExtreme(variances, (a, b) => a > b)]!;
  const low = groups[indexOfExtreme(variances, (a, b) => a < b)]!;
  const f = sampleVariance(high.meanPercent) / sampleVariance(low.meanPercent);
  const d1 = high.meanPercent.length - 1;
  const d2 = low.meanPercent.length - 1;
  return {
    label: `SD of run means, ${high.label} ÷ ${low.label}`,
    estimate: Math.sqrt(f),
    lower: Math.sqrt(f / fQuantile(0.975, d1, d2)),
    upper: Math.sqrt(f / fQuantile(0.025, d1, d2)),
    scale: 'ratio',
  };
}

/**
 * The run-level tests (each run one value): Welch's ANOVA and the one-way ANOVA on ln run CV and
 * on the within-run SD (% of target), and the Brown–Forsythe test on the run means (does the level
 * a run lands at vary more from run to run in some groups?). Each carries an effect size with its
 * 95 % interval between the two groups furthest apart. `attempt` records a failure as a warning.
 */
export function runLevelTests(groups: readonly RunLevelGroup[], attempt: (name: string, run: () => void) => void): RawTest[] {
  const tests: RawTest[] = [];
  const lnCv = groups.map((g) => g.lnCv);
  const sd = groups.map((g) => g.withinSdPercent);
  const means = [
    { values: lnCv, on: 'ln run CV', measure: 'run CV', effect: () => cvRatioEffect(groups), ids: ['welch-ln-cv', 'anova-ln-cv'] as const },
    { values: sd, on: 'within-run SD', measure: 'within-run scatter', effect: () => sdDifferenceEffect(groups), ids: ['welch-within-sd', 'anova-within-sd'] as const },
  ];
  for (const m of means) {
    // One effect per measure, shared by its two tests (Welch's and the one-way ANOVA).
    let effect: EffectSize | undefined;
    const effectOnce = () => (effect ??= m.effect());
    attempt(`Welch's ANOVA of ${m.on}`, () => {
      const r = welchAnova(m.values);
      tests.push({ id: m.ids[0], question: TEST_QUESTIONS[m.ids[0]], name: `Welch's ANOVA on ${m.on}`, statistic: r.statistic, pValue: r.pValue, df: `${r.dfBetween}, ${formatDecimals(r.dfWithin, 1)}`, measure: m.measure, effect: effectOnce() });
    });
    attempt(`The one-way ANOVA of ${m.on}`, () => {
      const r = oneWayAnova(m.values);
      tests.push({ id: m.ids[1], question: TEST_QUESTIONS[m.ids[1]], name: `One-way ANOVA on ${m.on}`, statistic: r.statistic, pValue: r.pValue, df: `${r.dfBetween}, ${r.dfWithin}`, measure: m.measure, effect: effectOnce() });
    });
  }
  attempt('The Brown–Forsythe test of run means', () => {
    const r = brownForsytheTest(groups.map((g) => g.meanPercent));
    tests.push({ id: 'spread-of-run-means', question: TEST_QUESTIONS['spread-of-run-means'], name: 'Brown–Forsythe test on run means', statistic: r.statistic, pValue: r.pValue, df: `${r.dfBetween}, ${r.dfWithin}`, measure: 'the run-to-run spread of run means', effect: runMeanSpreadEffect(groups) });
  });
  return tests;
}

/** Pairs on ln run CV, back-transformed to ratios of geometric-mean run CVs (family-wise 95 %). */
export function runCvPairs(groups: readonly RunLevelGroup[]): { gamesHowell: PairComparison[]; tukeyKramer: PairComparison[] } {
  const lnCv = groups.map((g) => g.lnCv);
  const asRatio = (c: { groupA: number; groupB: number; meanDifference: number; pValue: number; confidenceInterval: { lower: number; upper: number } }): PairComparison => ({
    a: groups[c.groupA]!.label,
    b: groups[c.groupB]!.label,
    ratio: Math.exp(c.meanDifference),
    lower: Math.exp(c.confidenceInterval.lower),
    upper: Math.exp(c.confidenceInterval.upper),
    pValue: c.pValue,
  });
  return { gamesHowell: gamesHowell(lnCv, { confidence: 0.95 }).comparisons.map(asRatio), tukeyKramer: tukeyHsd(lnCv, { confidence: 0.95 }).comparisons.map(asRatio) };
}

/** Pooled within-group SD of ln run CV (the planner's sdLogCv) and its degrees of freedom. */
export function pooledSdLogCv(groups: readonly RunLevelGroup[]): { sdLogCv: number; df: number } | null {
  let ss = 0;
  let df = 0;
  for (const g of groups) {
    if (g.lnCv.length < 2) continue;
    ss += sampleVariance(g.lnCv) * (g.lnCv.length - 1);
    df += g.lnCv.length - 1;
  }
  return df > 0 && ss > 0 ? { sdLogCv: Math.sqrt(ss / df), df } : null;
}

/**
 * Relaxation as the outcome: Welch's ANOVA on each run's % of final load lost during the hold after
 * its last pass (runs without such a hold left out), with the difference of means between the two
 * groups furthest apart (Welch t interval). Needs two groups with two or more held runs.
 */
export function relaxationTest(groups: readonly { label: string; relaxationPercent: number[] }[], attempt: (name: string, run: () => void) => void): RawTest[] {
  const held = groups.filter((g) => g.relaxationPercent.length >= 2);
  if (held.length < 2) return [];
  const tests: RawTest[] = [];
  attempt("Welch's ANOVA of relaxation", () => {
    const r = welchAnova(held.map((g) => g.relaxationPercent));
    const means = held.map((g) => mean(g.relaxationPercent));
    const high = held[indexOfExtreme(means, (a, b) => a > b)]!;
    const low = held[indexOfExtreme(means, (a, b) => a < b)]!;
    const t = welchTTest(high.relaxationPercent, low.relaxationPercent);
    tests.push({
      id: 'welch-relaxation',
      question: TEST_QUESTIONS['welch-relaxation'],
      name: "Welch's ANOVA on relaxation",
      statistic: r.statistic,
      pValue: r.pValue,
      df: `${r.dfBetween}, ${formatDecimals(r.dfWithin, 1)}`,
      measure: 'relaxation during the hold',
      effect: { label: `Relaxation, ${high.label} − ${low.label}`, estimate: t.meanDifference, lower: t.confidenceInterval.lower, upper: t.confidenceInterval.upper, scale: 'points' },
    });
  });
  return tests;
}
