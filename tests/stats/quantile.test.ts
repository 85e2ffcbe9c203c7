import { describe, expect, it } from 'vitest';
import { quantile, quantileSorted } from '@/lib/stats';
import { relativeError } from './support/lre';
import { scipyFixture } from './support/scipy-fixtures';

const fx = scipyFixture<{ values: number[]; probabilities: number[]; quantiles: number[] }>('quantiles.json');

describe('quantile', () => {
  it('quantile matches numpy.quantile(method="linear") (Hyndman–Fan type 7) on the seeded fixture', () => {
    fx.probabilities.forEach((p, i) => {
      // Reference: tests/fixtures/scipy/quantiles.json, numpy.quantile(..., method='linear').
      expect(relativeError(quantile(fx.values, p), fx.quantiles[i]!)).toBeLessThan(1e-12);
    });
  });

  it('quantileSorted on the sorted fixture matches numpy.quantile(method="linear") too, and equals quantile exactly', () => {
    const sorted = Float64Array.from(fx.values).sort();
    fx.probabilities.forEach((p, i) => {
      expect(relativeError(quantileSorted(sorted, p), fx.quantiles[i]!)).toBeLessThan(1e-12);
      expect(quantileSorted(sorted, p)).toBe(quantile(fx.values, p));
    });
    expect(() => quantileSorted(Float64Array.from([1, Number.NaN]).sort(), 0.5)).toThrow('quantileSorted requires finite values');
    expect(() => quantileSorted([], 0.5)).toThrow('quantileSorted requires at least one value');
  });

  it('quantile of 1, 2, 3, 4 at 0.25 is 1.75 (hand: h = 0.75)', () => {
    expect(quantile([4, 2, 1, 3], 0.25)).toBe(1.75);
    expect(quantile([5], 0.9)).toBe(5);
  });

  it('quantile does not reorder its input', () => {
    const x = [3, 1, 2];
    quantile(x, 0.5);
    expect(x).toEqual([3, 1, 2]);
  });

  it('quantile throws for p outside [0, 1], empty input and NaN', () => {
    expect(() => quantile([1, 2], 1.5)).toThrow('quantile requires p between 0 and 1 (got 1.5)');
    expect(() => quantile([], 0.5)).toThrow('quantile requires at least one value');
    expect(() => quantile([1, Number.NaN], 0.5)).toThrow('quantile requires finite values (got NaN at index 1)');
  });
});
