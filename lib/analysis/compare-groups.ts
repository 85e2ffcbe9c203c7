import { holmAdjust } from '../stats/holm-adjust';
import { reasonInWords } from './reason-in-words';
import { mean } from '../stats/mean';
import { sampleStandardDeviation } from '../stats/sample-standard-deviation';
import { sampleVariance } from '../stats/sample-variance';
import { varianceComponentsFromSummaries, type VarianceRunSummary } from '../stats/variance-components-from-summaries';
import { boxStats } from '../charts/box-stats';
import { pooledSdLogCv, relaxationTest, runCvPairs, runLevelTests, type RawTest, type RunLevelGroup } from './compare-run-tests';
import { traineeBlocks } from './compare-trainee-blocks';
import { groupGasketFigures } from './group-gasket';
import type { ComparedRun, ComparisonResult, ComparisonTest, ComparisonTestId, GroupInput, GroupSummary } from './compare-types';
import type { BoxSummary, ComparisonGroupData } from './types';
import { formatDecimals, formatInputValue } from '@/lib/calc/units';

export type { ComparedRun, ComparisonResult, ComparisonTest, ComparisonTestId, GroupInput, GroupSummary, PairComparison } from './compare-types';

/** Dots drawn per group at most; larger groups are drawn from an even sample, with the box from all values. */
export const MAX_DOTS_PER_GROUP = 400;

/**
 * A dot's position as the comparison's JSON carries it: 6 significant digits (0.0001 % of target,
 * far finer than a chart's pixel), so the cached answer is less than half the bytes of full doubles.
 * Only the drawn dots are rounded; every statistic and box is computed from the full values.
 */
export const dotValue = (value: number): number => Number(value.toPrecision(6));

/** An even, deterministic sample (every k-th value) of at most `max` values. */
export function evenSample(values: ArrayLike<number>, max: number): number[] {
  if (values.length <= max) return Array.from(values);
  const step = values.length / max;
  return Array.from({ length: max }, (_, i) => values[Math.floor(i * step)]!);
}

function boxOf(values: readonly number[] | Float64Array): BoxSummary | undefined {
  const box = boxStats(values);
  if (!box) return undefined;
  return { ...box, outliers: evenSample(box.outliers, MAX_DOTS_PER_GROUP).map(dotValue) };
}

/** Fewer runs than this in a group make the tests say little (common practice: a handful per group at least). */
export const SMALL_GROUP_RUNS = 5;

/** The planned outcome when none is chosen: the run CV under unequal variances. */
export const DEFAULT_PLANNED: ComparisonTestId = 'welch-ln-cv';

const safeMean = (values: number[]) => (values.length ? mean(values) : null);
const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
const formatP = (p: number) => (p < 0.001 ? 'p < 0.001' : `p = ${formatInputValue(p, 2)}`);

/** A run's own figures (% of target), or null when it has fewer than two final loads. */
function runProfile(run: ComparedRun): { meanPercent: number; sdPercent: number; cv: number } | null {
  if (run.finalLoadsN.length < 2) return null;
  const m = run.stored ? run.stored.meanN : mean(run.finalLoadsN);
  const sd = run.stored ? run.stored.sdN : sampleStandardDeviation(run.finalLoadsN);
  return m > 0 ? { meanPercent: (m / run.targetLoadN) * 100, sdPercent: (sd / run.targetLoadN) * 100, cv: sd / m } : null;
}

/** A run's size, mean and sample variance in % of target (from its stored figures when it has them), for the variance components. */
function varianceSummary(run: ComparedRun): VarianceRunSummary {
  const percent = (load: number) => (load / run.targetLoadN) * 100;
  if (run.stored) return { n: run.finalLoadsN.length, mean: percent(run.stored.meanN), variance: percent(run.stored.sdN) ** 2 };
  const loads = run.finalLoadsN.map(percent);
  return { n: loads.length, mean: mean(loads), variance: sampleVariance(loads) };
}

/** Within-run and between-run SDs (% of target) with their 95 % intervals, or null when they cannot be computed. */
function componentsOf(runsOfGroup: readonly ComparedRun[]): GroupSummary['components'] {
  const runs = runsOfGroup.filter((r) => r.finalLoadsN.length >= 2);
  if (runs.length < 2) return null;
  try {
    const vc = varianceComponentsFromSummaries(runs.map(varianceSummary), { confidence: 0.95 }, 'varianceComponents');
    const sd = (v: { variance: number; lower: number; upper: number }) => ({ value: Math.sqrt(v.variance), lower: Math.sqrt(v.lower), upper: Math.sqrt(v.upper) });
    return {
      withinRunSd: sd(vc.withinRun),
      betweenRunSd: sd(vc.betweenRun),
      withinMethod: 'exact chi-square interval',
      betweenMethod: vc.betweenRun.method === 'modified large-sample' ? 'modified large-sample interval' : 'modified large-sample interval (unweighted means, runs of different sizes)',
    };
  } catch {
    return null;
  }
}

/** The reading of a test in words, on its Holm-adjusted p-value. */
function readingOf(test: RawTest, adjusted: number, subject: string, alpha: number): string {
  const level = `${formatInputValue(alpha * 100, 3)} % level`;
  const numbers = `${test.name}: ${formatDecimals(test.statistic, 2)}, df ${test.df}, ${formatP(test.pValue)}; Holm-adjusted ${formatP(adjusted)}`;
  return adjusted < alpha
    ? `${capitalise(test.measure)} differs between ${subject} at the ${level} (${numbers}).`
    : `No evidence at the ${level} that ${test.measure} differs between ${subject} (${numbers}).`;
}

/**
 * Compares groups of runs with the run as the unit: each run is reduced to its own mean, within-run
 * SD (% of target) and CV, and the tests compare those run-level values (`runLevelTests`), with
 * Games–Howell and Tukey–Kramer pairs on ln run CV; operators as blocks in a random-intercept model
 * (`traineeBlocks`) unless the operators are the groups (`blocks: false`); Holm's adjustment across
 * all tests of the comparison, one of them labelled planned. Each group shows its variance
 * components (stud to stud within a run, and run to run). Drift by position is averaged only when
 * every run has the same stud count. `subject` names the groups ("these methods").
 */
export function compareGroups(inputs: GroupInput[], options: { subject: string; alpha?: number; planned?: ComparisonTestId; blocks?: boolean }): ComparisonResult {
  const alpha = options.alpha ?? 0.05;
  const planned = options.planned ?? DEFAULT_PLANNED;
  const warnings: string[] = [];
  const attempt = (name: string, run: () => void) => {
    try {
      run();
    } catch (error) {
      warnings.push(`${name} could not be computed: ${reasonInWords(error)}.`);
    }
  };
  const seenStudCounts = new Set<number>();
  for (const g of inputs) for (const r of g.runs) if (r.finalLoadsN.length > 0) seenStudCounts.add(r.finalLoadsN.length);
  const studCounts = [...seenStudCounts].sort((a, b) => a - b);
  const groups: GroupSummary[] = [];
  const chartGroups: ComparisonGroupData[] = [];
  const runLevel: (RunLevelGroup & { key: string; blocked: { lnCv: number; operator: string | number; attempt: number | null }[]; relaxationPercent: number[] })[] = [];
  inputs.forEach((input, index) => {
    const loadsPercent = loadsPercentOf(input.runs);
    const level: (typeof runLevel)[number] = { key: input.key, label: input.label, lnCv: [], withinSdPercent: [], meanPercent: [], blocked: [], relaxationPercent: [] };
    const cvs: number[] = [];
    input.runs.forEach((run) => {
      if (typeof run.relaxationPercent === 'number') level.relaxationPercent.push(run.relaxationPercent);
      const p = runProfile(run);
      if (!p) return;
      level.meanPercent.push(p.meanPercent);
      level.withinSdPercent.push(p.sdPercent);
      cvs.push(p.cv);
      if (p.cv > 0) {
        level.lnCv.push(Math.log(p.cv));
        if (run.operator !== undefined) level.blocked.push({ lnCv: Math.log(p.cv), operator: run.operator, attempt: run.attempt ?? null });
      }
    });
    runLevel.push(level);
    groups.push({
      key: input.key,
      label: input.label,
      colourIndex: index % 8,
      runs: input.runs.length,
      studs: loadsPercent.length,
      meanPercent: safeMean(level.meanPercent),
      geometricMeanRunCv: level.lnCv.length ? Math.exp(mean(level.lnCv)) : null,
      meanRunCv: safeMean(cvs),
      meanWithinSdPercent: safeMean(level.withinSdPercent),
      components: componentsOf(input.runs),
      meanRelaxationPercent: safeMean(level.relaxationPercent),
      runsWithHold: level.relaxationPercent.length,
      gasket: groupGasketFigures(input.runs),
    });
    const drift = studCounts.length === 1 ? meanDriftByPosition(input.runs, studCounts[0]!) : [];
    const large = loadsPercent.length > MAX_DOTS_PER_GROUP || cvs.length > MAX_DOTS_PER_GROUP;
    chartGroups.push({
      key: input.key,
      label: input.label,
      colourIndex: index % 8,
      finalLoadsPercent: evenSample(loadsPercent, MAX_DOTS_PER_GROUP).map(dotValue),
      runCvs: evenSample(cvs, MAX_DOTS_PER_GROUP).map(dotValue),
      ...(large ? { finalLoadsBox: boxOf(loadsPercent.slice()), runCvBox: boxOf(cvs.map((cv) => cv * 100)) } : {}),
      meanDriftByPosition: drift,
    });
    if (input.runs.length < SMALL_GROUP_RUNS) {
      warnings.push(`${input.label} has only ${input.runs.length} run${input.runs.length === 1 ? '' : 's'}: with fewer than ${SMALL_GROUP_RUNS}, the tests below say little about it.`);
    }
  });

  const usable = runLevel.filter((g) => g.lnCv.length >= 2);
  const raw: RawTest[] = [];
  let pairs: ComparisonResult['pairs'] = { gamesHowell: [], tukeyKramer: [] };
  let blocks: ComparisonResult['traineeBlocks'] = null;
  if (usable.length >= 2) {
    raw.push(...runLevelTests(usable, attempt));
    attempt('The pairs of groups', () => {
      pairs = runCvPairs(usable);
    });
    if (options.blocks === false) {
      warnings.push('Operators are the groups here, so they cannot also be the blocks: the mixed model is left out.');
    } else if (usable.some((g) => g.blocked.length !== g.lnCv.length)) {
      warnings.push('Some runs have no operator, so the mixed model with operators as blocks is left out.');
    } else {
      attempt('The mixed model with operators as blocks', () => {
        const fitted = traineeBlocks(usable.map((g) => ({ key: g.key, label: g.label, runs: g.blocked })));
        blocks = fitted.blocks;
        raw.push(fitted.test);
      });
    }
  } else {
    warnings.push('At least two groups with two or more runs each are needed to compare runs.');
  }
  raw.push(...relaxationTest(runLevel, attempt));
  if (planned === 'welch-relaxation' && !raw.some((t) => t.id === 'welch-relaxation')) {
    warnings.push('Relaxation was chosen as the outcome, but fewer than two groups have two or more runs with hold readings after the last pass.');
  }
  const adjusted = raw.length ? holmAdjust(raw.map((t) => t.pValue)) : [];
  const tests: ComparisonTest[] = raw.map(({ measure: _measure, ...t }, i) => ({
    ...t,
    adjustedPValue: adjusted[i]!,
    planned: t.id === planned,
    reading: readingOf(raw[i]!, adjusted[i]!, options.subject, alpha),
  }));
  tests.sort((a, b) => Number(b.planned) - Number(a.planned));
  const pooled = pooledSdLogCv(runLevel);
  return { groups, chartGroups, tests, pairs, traineeBlocks: blocks, planner: pooled, planned, studCounts, warnings };
}

/** Every final load of the group's runs, % of the run's target, in run order. */
function loadsPercentOf(runs: readonly ComparedRun[]): Float64Array {
  let size = 0;
  for (const run of runs) size += run.finalLoadsN.length;
  const out = new Float64Array(size);
  let at = 0;
  for (const run of runs) {
    for (const load of run.finalLoadsN) out[at++] = (load / run.targetLoadN) * 100;
  }
  return out;
}

/** Mean drift (%) by position over the runs of one stud count. */
function meanDriftByPosition(runs: readonly ComparedRun[], studCount: number): number[] {
  const byPosition = Array.from({ length: studCount }, () => [] as number[]);
  for (const run of runs) {
    for (let p = 0; p < studCount; p++) {
      const v = run.driftPercent[p];
      if (typeof v === 'number') byPosition[p]!.push(v);
    }
  }
  return byPosition.map((values) => (values.length ? mean(values) : 0));
}
