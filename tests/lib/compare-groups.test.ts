import { mean, median, sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { compareGroups, evenSample, MAX_DOTS_PER_GROUP, SMALL_GROUP_RUNS, type GroupInput } from '@/lib/analysis/compare-groups';

// Two invented groups of 4-stud runs with a 100 kN target; expected figures are recomputed here
// with simple-statistics (an outside reference library), not with the project's own functions.
const target = 100_000;
const run = (loads: number[], drift: number[] = [-5, -3, -1, 0]) => ({ targetLoadN: target, finalLoadsN: loads.map((l) => l * 1000), driftPercent: drift });
const even: GroupInput = { key: 'a', label: 'Three passes', runs: [run([99, 101, 100, 100]), run([98, 100, 101, 99]), run([100, 102, 99, 101]), run([101, 99, 100, 98]), run([100, 100, 101, 99])] };
const uneven: GroupInput = { key: 'b', label: 'One pass', runs: [run([80, 95, 110, 120]), run([85, 90, 115, 105]), run([78, 99, 104, 118]), run([90, 88, 112, 111]), run([84, 97, 108, 116])] };

describe('compareGroups', () => {
  const result = compareGroups([even, uneven], { subject: 'these methods' });

  it('pools final loads as % of target per group, matching simple-statistics', () => {
    const pooled = uneven.runs.flatMap((r) => r.finalLoadsN.map((l) => (l / target) * 100));
    const g = result.groups[1]!;
    expect(g.studs).toBe(20);
    expect(g.meanPercent).toBeCloseTo(mean(pooled), 10);
    expect(g.sdPercent).toBeCloseTo(sampleStandardDeviation(pooled), 10);
    expect(g.cv).toBeCloseTo(sampleStandardDeviation(pooled) / mean(pooled), 12);
    expect(g.cvInterval!.lower).toBeLessThan(g.cv!);
    expect(g.cvInterval!.upper).toBeGreaterThan(g.cv!);
  });

  it('finds the one-pass group scatters more, in every scatter test and in the run CVs', () => {
    const names = result.tests.map((t) => t.name);
    expect(names).toEqual(expect.arrayContaining(["Levene's test (mean-centred)", 'Brown–Forsythe test (median-centred)', "Bartlett's test", 'One-way ANOVA of run CVs', "Welch's ANOVA of run CVs"]));
    for (const test of result.tests) {
      expect(test.pValue).toBeLessThan(0.05);
      expect(test.reading).toMatch(/5 % level/);
    }
    expect(result.tests.find((t) => t.name === 'One-way ANOVA of run CVs')!.reading).toMatch(/^Mean run CV differs between these methods/);
    expect(result.pairs).toHaveLength(1);
    expect(result.groups[0]!.meanRunCv!).toBeLessThan(result.groups[1]!.meanRunCv!);
  });

  it('averages drift by position across a group', () => {
    expect(result.chartGroups[0]!.meanDriftByPosition).toEqual([-5, -3, -1, 0]);
  });

  it(`warns when a group has fewer than ${SMALL_GROUP_RUNS} runs and skips what cannot run`, () => {
    const tiny = compareGroups([{ ...even, runs: even.runs.slice(0, 1) }, uneven], { subject: 'these methods' });
    expect(tiny.warnings.some((w) => w.startsWith('Three passes has only 1 run'))).toBe(true);
    expect(tiny.warnings.some((w) => /compare run CVs/.test(w))).toBe(true);
    expect(tiny.tests.some((t) => t.name.includes('Levene'))).toBe(true);
  });
});

describe('evenSample and large groups', () => {
  it('keeps every value of a small sample and an even stride of a large one', () => {
    expect(evenSample([1, 2, 3], 5)).toEqual([1, 2, 3]);
    const hundred = Array.from({ length: 100 }, (_, i) => i);
    expect(evenSample(hundred, 4)).toEqual([0, 25, 50, 75]);
  });

  it(`draws at most ${MAX_DOTS_PER_GROUP} dots per group but takes the box and the tests from all values`, () => {
    const many: GroupInput = { key: 'm', label: 'Many', runs: Array.from({ length: 120 }, (_, i) => run([95 + (i % 7), 100, 103 - (i % 5), 99])) };
    const big = compareGroups([many, uneven], { subject: 'these methods' });
    const chart = big.chartGroups[0]!;
    expect(chart.finalLoadsPercent).toHaveLength(MAX_DOTS_PER_GROUP);
    expect(chart.finalLoadsBox!.n).toBe(480);
    // Median of all 480 values, recomputed with simple-statistics (an outside reference).
    const all = many.runs.flatMap((r) => r.finalLoadsN.map((l) => (l / target) * 100));
    expect(chart.finalLoadsBox!.median).toBeCloseTo(median(all), 10);
    expect(big.groups[0]!.studs).toBe(480);
  });
});
