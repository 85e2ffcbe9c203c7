import { describe, expect, it } from 'vitest';
import { bartlettTest, brownForsytheTest, leveneTest } from '@/lib/stats';
import { readGear } from './support/gear';
import { relativeError } from './support/lre';
import { type ComparisonFixture, scipyFixture } from './support/scipy-fixtures';

const gearFx = scipyFixture<ComparisonFixture>('gear.json');
const loadsFx = scipyFixture<ComparisonFixture>('comparisons.json');
const gear = readGear();

describe('brownForsytheTest', () => {
  it('brownForsytheTest on NIST GEAR.DAT gives the e-Handbook Levene example W ≈ 1.705910, p ≈ 0.0991, df (9, 90)', () => {
    // Source: NIST/SEMATECH e-Handbook §1.3.5.10 as quoted in JuliaStats HypothesisTests.jl test/var_equality.jl
    // (see tests/fixtures/reference/README.md): W ≈ 1.705910 (atol 1e-5), p ≈ 0.0991 (atol 1e-4). The handbook's
    // example is median-centred, i.e. Brown–Forsythe.
    const r = brownForsytheTest(gear);
    expect(Math.abs(r.statistic - 1.70591)).toBeLessThan(1e-5);
    expect(Math.abs(r.pValue - 0.0991)).toBeLessThan(1e-4);
    expect([r.dfBetween, r.dfWithin]).toEqual([9, 90]);
  });
  it('brownForsytheTest matches scipy.stats.levene(center="median") on GEAR.DAT and on seeded loads to 1e-9', () => {
    for (const fx of [gearFx, loadsFx]) {
      const r = brownForsytheTest(fx.groups);
      expect(relativeError(r.statistic, fx.leveneMedian.statistic)).toBeLessThan(1e-9);
      expect(relativeError(r.pValue, fx.leveneMedian.pValue)).toBeLessThan(1e-9);
    }
  });
  it('brownForsytheTest rejects a one-value group', () => {
    expect(() => brownForsytheTest([[1, 2], [3]])).toThrow('brownForsytheTest requires at least two values of group 2 (got 1)');
  });
});

describe('leveneTest', () => {
  it('leveneTest (mean-centred) matches scipy.stats.levene(center="mean") on GEAR.DAT and seeded loads to 1e-9', () => {
    for (const fx of [gearFx, loadsFx]) {
      const r = leveneTest(fx.groups);
      expect(relativeError(r.statistic, fx.leveneMean.statistic)).toBeLessThan(1e-9);
      expect(relativeError(r.pValue, fx.leveneMean.pValue)).toBeLessThan(1e-9);
    }
  });
  it('leveneTest of 1,2,3 vs 2,4,6 is W = 0.8 (hand: |dev| 1,0,1 vs 2,0,2; SSB 2/3, SSW 10/3, df 1 and 4)', () => {
    expect(relativeError(leveneTest([[1, 2, 3], [2, 4, 6]]).statistic, 0.8)).toBeLessThan(1e-14);
  });
  it('leveneTest rejects one group and NaN', () => {
    expect(() => leveneTest([[1, 2]])).toThrow('leveneTest requires at least two groups');
    expect(() => leveneTest([[1, 2], [Number.NaN, 1]])).toThrow('leveneTest requires finite values (got NaN at index 0 of group 2)');
  });
});

describe('bartlettTest', () => {
  it('bartlettTest on GEAR.DAT gives T = 20.785873428064864 (scipy.stats.bartlett; recomputed in tests/fixtures/reference/README.md)', () => {
    const r = bartlettTest(gear);
    expect(relativeError(r.statistic, 20.785873428064864)).toBeLessThan(1e-9);
    expect(relativeError(r.pValue, gearFx.bartlett.pValue)).toBeLessThan(1e-9);
    expect(r.df).toBe(9);
  });
  it('bartlettTest matches scipy.stats.bartlett on seeded loads to 1e-9', () => {
    const r = bartlettTest(loadsFx.groups);
    expect(relativeError(r.statistic, loadsFx.bartlett.statistic)).toBeLessThan(1e-9);
    expect(relativeError(r.pValue, loadsFx.bartlett.pValue)).toBeLessThan(1e-9);
  });
  it('bartlettTest rejects a constant group', () => {
    expect(() => bartlettTest([[1, 2], [3, 3]])).toThrow('bartlettTest requires some variation within every group (group 2 is constant)');
  });
});
