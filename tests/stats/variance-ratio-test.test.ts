import { describe, expect, it } from 'vitest';
import { varianceRatioTest } from '@/lib/stats';
import { relativeError } from './support/lre';
import { type ComparisonFixture, scipyFixture } from './support/scipy-fixtures';

const fx = scipyFixture<ComparisonFixture>('comparisons.json');

describe('varianceRatioTest', () => {
  it('varianceRatioTest matches the scipy F-test (var ratio, 2·min(f.sf, f.cdf)) on seeded loads to 1e-9', () => {
    const e = fx.varianceRatio!;
    const r = varianceRatioTest(fx.groups[0]!, fx.groups[1]!);
    expect(relativeError(r.statistic, e.statistic)).toBeLessThan(1e-9);
    expect(relativeError(r.pValue, e.pValue)).toBeLessThan(1e-9);
    expect([r.dfNumerator, r.dfDenominator]).toEqual([e.dfNumerator, e.dfDenominator]);
  });
  it('varianceRatioTest is symmetric: swapping samples inverts F and keeps p', () => {
    const a = varianceRatioTest(fx.groups[0]!, fx.groups[1]!);
    const b = varianceRatioTest(fx.groups[1]!, fx.groups[0]!);
    expect(relativeError(b.statistic, 1 / a.statistic)).toBeLessThan(1e-14);
    expect(relativeError(b.pValue, a.pValue)).toBeLessThan(1e-12);
  });
  it('varianceRatioTest rejects a constant sample', () => {
    expect(() => varianceRatioTest([1, 1], [1, 2])).toThrow('varianceRatioTest requires some variation in both samples');
  });
});
