import { describe, expect, it } from 'vitest';
import { oneWayAnova, tukeyHsd, welchAnova, welchTTest } from '@/lib/stats';
import { relativeError } from './support/lre';
import { expectPairsToMatch } from './support/pairwise-comparisons';
import { type ComparisonFixture, scipyFixture } from './support/scipy-fixtures';

const gearFx = scipyFixture<ComparisonFixture>('gear.json');
const loadsFx = scipyFixture<ComparisonFixture>('comparisons.json');

describe('oneWayAnova (beyond NIST StRD)', () => {
  it('oneWayAnova matches scipy.stats.f_oneway F and p on GEAR.DAT and seeded loads to 1e-9', () => {
    for (const fx of [gearFx, loadsFx]) {
      const r = oneWayAnova(fx.groups);
      expect(relativeError(r.statistic, fx.fOneway.statistic)).toBeLessThan(1e-9);
      expect(relativeError(r.pValue, fx.fOneway.pValue)).toBeLessThan(1e-9);
    }
  });
  it('oneWayAnova of 1,2,3 vs 4,5,6 is F = 13.5 (hand: SSB 13.5/1, SSW 4/4)', () => {
    expect(oneWayAnova([[1, 2, 3], [4, 5, 6]]).statistic).toBe(13.5);
  });
  it('oneWayAnova rejects one group, too few values and constant groups', () => {
    expect(() => oneWayAnova([[1, 2, 3]])).toThrow('oneWayAnova requires at least two groups');
    expect(() => oneWayAnova([[1], [2]])).toThrow('oneWayAnova requires more values than groups');
    expect(() => oneWayAnova([[1, 1], [2, 2]])).toThrow('oneWayAnova requires some variation within groups');
    expect(() => oneWayAnova([[1, 2], []])).toThrow('oneWayAnova requires at least one value of group 2');
  });
});

describe('welchAnova', () => {
  it('welchAnova matches scipy.stats.f_oneway(equal_var=False) on GEAR.DAT and seeded loads to 1e-9', () => {
    for (const fx of [gearFx, loadsFx]) {
      const r = welchAnova(fx.groups);
      expect(relativeError(r.statistic, fx.welchAnova.statistic)).toBeLessThan(1e-9);
      expect(relativeError(r.pValue, fx.welchAnova.pValue)).toBeLessThan(1e-9);
    }
  });
  it('welchAnova with two groups equals the square of Welch’s t (identity, Welch 1951)', () => {
    const [a, b] = loadsFx.groups as [number[], number[]];
    const w = welchAnova([a, b]);
    const t = welchTTest(a, b);
    expect(relativeError(w.statistic, t.statistic ** 2)).toBeLessThan(1e-12);
    expect(relativeError(w.dfWithin, t.df)).toBeLessThan(1e-12);
  });
  it('welchAnova rejects a constant group', () => {
    expect(() => welchAnova([[1, 2], [3, 3]])).toThrow('welchAnova requires some variation within every group (group 2 is constant)');
  });
});

describe('welchTTest', () => {
  it('welchTTest matches scipy.stats.ttest_ind(equal_var=False): t, df, p and 95 % interval to 1e-9', () => {
    const fx = loadsFx.welchTTest!;
    const r = welchTTest(loadsFx.groups[0]!, loadsFx.groups[1]!);
    expect(relativeError(r.statistic, fx.statistic)).toBeLessThan(1e-9);
    expect(relativeError(r.df, fx.df)).toBeLessThan(1e-9);
    expect(relativeError(r.pValue, fx.pValue)).toBeLessThan(1e-9);
    expect(relativeError(r.confidenceInterval.lower, fx.lower)).toBeLessThan(1e-9);
    expect(relativeError(r.confidenceInterval.upper, fx.upper)).toBeLessThan(1e-9);
  });
  it('welchTTest rejects one-value samples', () => {
    expect(() => welchTTest([1], [1, 2])).toThrow('welchTTest requires at least two values of sample a (got 1)');
  });
});

describe('tukeyHsd', () => {
  // Tolerances and why: see expectPairsToMatch (tests/stats/support/pairwise-comparisons.ts).
  it('tukeyHsd (Tukey–Kramer) matches scipy.stats.tukey_hsd on GEAR.DAT and unequal-n seeded loads', () => {
    for (const fx of [gearFx, loadsFx]) {
      expectPairsToMatch(tukeyHsd(fx.groups).comparisons, fx.tukeyHsd.pairs);
    }
  });
  it('tukeyHsd q for 1,2,3 | 4,5,6 | 7,8,9 is 3/√(1/3) per adjacent pair (hand: MSW = 1, n = 3)', () => {
    const r = tukeyHsd([[1, 2, 3], [4, 5, 6], [7, 8, 9]]);
    expect(relativeError(r.comparisons[0]!.statistic, 3 / Math.sqrt(1 / 3))).toBeLessThan(1e-14);
  });
});
