import { median } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { compareGroups, evenSample, MAX_DOTS_PER_GROUP, SMALL_GROUP_RUNS, type GroupInput } from '@/lib/analysis/compare-groups';
import { storedRunFigures } from '@/lib/record/run-figures';
import fixture from '../fixtures/scipy/compare-selection.json';

// A hand-made selection (three groups of 4-stud runs by four operators, attempts numbered per
// operator) written by scripts/generate-compare-fixtures.py, with every expected figure computed
// there by scipy and statsmodels (the fixture records their versions): statsmodels anova_oneway
// (Welch), scipy f_oneway, scipy levene(center='median'), statsmodels multipletests('holm'),
// the Welch t interval from scipy's t, TTestIndPower.solve_power, MixedLM.
const inputs: GroupInput[] = fixture.groups.map((g) => ({
  key: g.key,
  label: g.label,
  runs: fixture.runs.filter((r) => r.group === g.key).map((r) => ({ targetLoadN: fixture.targetLoadN, finalLoadsN: r.finalLoadsN, driftPercent: [-4, -2, -1, 0], operator: r.operator, attempt: r.attempt })),
}));
const close = (actual: number, expected: number, relative: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(relative * Math.abs(expected));

describe('compareGroups on a hand-made selection (run as the unit)', () => {
  const result = compareGroups(inputs, { subject: 'these methods' });
  const test = (id: string) => result.tests.find((t) => t.id === id)!;

  it('runs every run-level test and matches scipy/statsmodels statistics and p-values', () => {
    for (const id of ['welch-ln-cv', 'anova-ln-cv', 'welch-within-sd', 'anova-within-sd', 'spread-of-run-means'] as const) {
      const expected = fixture.tests[id];
      close(test(id).statistic, expected.statistic, 1e-9);
      close(test(id).pValue, expected.pValue, 1e-7);
    }
  });

  it('tests the group effect with operators as blocks by a likelihood-ratio test of ML fits (statsmodels MixedLM)', () => {
    close(test('trainee-blocks').statistic, fixture.tests['trainee-blocks'].statistic, 1e-4);
    close(test('trainee-blocks').pValue, fixture.tests['trainee-blocks'].pValue, 1e-4);
    const blocks = result.traineeBlocks!;
    expect(blocks.operators).toBe(fixture.traineeBlocks.operators);
    expect(blocks.perAttempt).not.toBeNull();
    for (const e of blocks.estimates.slice(1)) {
      const expected = fixture.traineeBlocks.estimates[e.key as 'b' | 'c'];
      close(e.ratio, expected.ratio, 1e-4);
      // Wald interval: contains the estimate; its lme4-style standard errors are checked in tests/stats.
      expect(e.lower).toBeLessThan(e.ratio);
      expect(e.upper).toBeGreaterThan(e.ratio);
    }
  });

  it("adjusts across all tests of the comparison by Holm's method (statsmodels multipletests)", () => {
    for (const t of result.tests) close(t.adjustedPValue, fixture.tests[t.id as keyof typeof fixture.tests].adjustedPValue, 1e-4);
  });

  it('labels one test planned (first) and the rest exploratory', () => {
    expect(result.tests[0]!.id).toBe('welch-ln-cv');
    expect(result.tests.filter((t) => t.planned).map((t) => t.id)).toEqual(['welch-ln-cv']);
    const other = compareGroups(inputs, { subject: 'these methods', planned: 'trainee-blocks' });
    expect(other.tests[0]!.id).toBe('trainee-blocks');
    expect(other.tests.filter((t) => t.planned)).toHaveLength(1);
  });

  it('gives the CV ratio of the groups furthest apart with its Welch interval (scipy t, exponentiated)', () => {
    const effect = test('welch-ln-cv').effect!;
    const labelOf = (key: string) => fixture.groups.find((g) => g.key === key)!.label;
    expect(effect.label).toBe(`Run CV, ${labelOf(fixture.cvRatio.high)} ÷ ${labelOf(fixture.cvRatio.low)}`);
    close(effect.estimate, fixture.cvRatio.ratio, 1e-12);
    close(effect.lower, fixture.cvRatio.lower, 1e-9);
    close(effect.upper, fixture.cvRatio.upper, 1e-9);
    for (const t of result.tests) expect(t.effect).not.toBeNull();
  });

  it('gives the planner the pooled within-group SD of ln run CV (its N matches TTestIndPower)', () => {
    close(result.planner!.sdLogCv, fixture.planner.sdLogCv, 1e-12);
    expect(result.planner!.df).toBe(fixture.planner.df);
  });

  it('shows variance components per group with intervals around them', () => {
    for (const g of result.groups) {
      const c = g.components!;
      expect(c.withinRunSd.lower).toBeLessThan(c.withinRunSd.value);
      expect(c.withinRunSd.upper).toBeGreaterThan(c.withinRunSd.value);
      expect(c.withinMethod).toBe('exact chi-square interval');
      expect(c.betweenMethod).toMatch(/^modified large-sample interval/);
    }
  });

  it('leaves the mixed model out when the operators are the groups', () => {
    const r = compareGroups(inputs, { subject: 'these operators', blocks: false });
    expect(r.traineeBlocks).toBeNull();
    expect(r.tests.some((t) => t.id === 'trainee-blocks')).toBe(false);
    expect(r.warnings.some((w) => /cannot also be the blocks/.test(w))).toBe(true);
  });

  it('averages drift by position only within one stud count', () => {
    expect(result.studCounts).toEqual([4]);
    expect(result.chartGroups[0]!.meanDriftByPosition).toEqual([-4, -2, -1, 0]);
    const mixed = compareGroups([{ ...inputs[0]!, runs: [...inputs[0]!.runs, { targetLoadN: 100_000, finalLoadsN: [1, 2, 3, 4, 5, 6, 7, 8].map((v) => 99_000 + v * 300), driftPercent: [0, 0, 0, 0, 0, 0, 0, 0] }] }, inputs[1]!], { subject: 'these methods' });
    expect(mixed.studCounts).toEqual([4, 8]);
    expect(mixed.chartGroups.every((g) => g.meanDriftByPosition.length === 0)).toBe(true);
  });

  it(`warns when a group has fewer than ${SMALL_GROUP_RUNS} runs and skips what cannot run`, () => {
    const tiny = compareGroups([{ ...inputs[0]!, runs: inputs[0]!.runs.slice(0, 1) }, inputs[1]!], { subject: 'these methods' });
    expect(tiny.warnings.some((w) => w.startsWith(`${inputs[0]!.label} has only 1 run`))).toBe(true);
    expect(tiny.warnings.some((w) => /compare runs/.test(w))).toBe(true);
    expect(tiny.tests).toHaveLength(0);
  });
});

describe('evenSample and large groups', () => {
  const target = 100_000;
  const run = (loads: number[]) => ({ targetLoadN: target, finalLoadsN: loads.map((l) => l * 1000), driftPercent: [] });
  it('keeps every value of a small sample and an even stride of a large one', () => {
    expect(evenSample([1, 2, 3], 5)).toEqual([1, 2, 3]);
    const hundred = Array.from({ length: 100 }, (_, i) => i);
    expect(evenSample(hundred, 4)).toEqual([0, 25, 50, 75]);
  });

  it(`draws at most ${MAX_DOTS_PER_GROUP} dots per group but takes the box and the tests from all values`, () => {
    const many: GroupInput = { key: 'm', label: 'Many', runs: Array.from({ length: 120 }, (_, i) => run([95 + (i % 7), 100, 103 - (i % 5), 99])) };
    const big = compareGroups([many, inputs[1]!], { subject: 'these methods' });
    const chart = big.chartGroups[0]!;
    expect(chart.finalLoadsPercent).toHaveLength(MAX_DOTS_PER_GROUP);
    expect(chart.finalLoadsBox!.n).toBe(480);
    // Median of all 480 values, recomputed with simple-statistics (an outside reference).
    const all = many.runs.flatMap((r) => r.finalLoadsN.map((l) => (l / target) * 100));
    expect(chart.finalLoadsBox!.median).toBeCloseTo(median(all), 10);
    expect(big.groups[0]!.studs).toBe(480);
  });
});

describe('compareGroups with the stored per-run figures', () => {
  it('matches scipy/statsmodels the same when each run brings its stored mean and SD (storedRunFigures)', () => {
    const withStored: GroupInput[] = inputs.map((g) => ({
      ...g,
      runs: g.runs.map((r) => {
        const figures = storedRunFigures({ studCount: r.finalLoadsN.length, targetLoadN: r.targetLoadN, steps: [{ order: 1, pass: 1, position: 1, loadsN: r.finalLoadsN }] });
        return { ...r, stored: { meanN: figures.finalMeanN!, sdN: figures.finalSdN! } };
      }),
    }));
    const result = compareGroups(withStored, { subject: 'these methods' });
    for (const id of ['welch-ln-cv', 'anova-ln-cv', 'welch-within-sd', 'anova-within-sd', 'spread-of-run-means'] as const) {
      const found = result.tests.find((t) => t.id === id)!;
      close(found.statistic, fixture.tests[id].statistic, 1e-9);
      close(found.pValue, fixture.tests[id].pValue, 1e-7);
    }
  });
});
