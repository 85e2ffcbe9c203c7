import * as ss from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { mean, StatsError } from '@/lib/stats';
import { relativeError } from './support/lre';
import { seededUniform } from './support/seeded-random';

describe('mean', () => {
  it('mean agrees with simple-statistics mean to 1e-14 relative on seeded random loads', () => {
    for (let seed = 1; seed <= 20; seed++) {
      const x = seededUniform(seed, 50 + seed, 80_000, 120_000);
      // Reference: simple-statistics 7.12 `mean` (compensated sum / n).
      expect(relativeError(mean(x), ss.mean(x))).toBeLessThan(1e-14);
    }
  });

  it('mean of 1e9 + small offsets is exact where the naive running sum is not', () => {
    // Hand computation: 1e9 + {0.1, 0.2, 0.3} has mean 1e9 + 0.2; doubles near 1e9 are spaced 1.2e-7.
    const x = [1e9 + 0.1, 1e9 + 0.2, 1e9 + 0.3];
    expect(relativeError(mean(x), 1e9 + 0.2)).toBeLessThan(2e-16);
  });

  it('mean of constant data is that constant', () => {
    expect(mean(Array.from({ length: 1000 }, () => 0.1))).toBe(0.1); // hand: exact
  });

  it('mean of two values and of one value', () => {
    expect(mean([1, 4])).toBe(2.5); // hand
    expect(mean([42])).toBe(42); // hand
  });

  it('mean does not overflow on values near 1e308 and keeps 1e-300 magnitudes', () => {
    // Hand: the mean of n copies of v is v. The plain sum of 1e308 values overflows.
    expect(mean([1e308, 1e308, 1e308])).toBe(1e308);
    expect(relativeError(mean([1e300, 3e300]), 2e300)).toBeLessThan(1e-15);
    expect(relativeError(mean([1e-300, 3e-300]), 2e-300)).toBeLessThan(1e-15);
    // simple-statistics' compensated sum overflows here (the behaviour we improve on):
    expect(Number.isFinite(ss.mean([1e308, 1e308, 1e308]))).toBe(false);
  });

  it('mean throws StatsError on empty input and on NaN, naming the index', () => {
    expect(() => mean([])).toThrow(new StatsError('mean requires at least one value'));
    expect(() => mean([1, 2, 3, Number.NaN])).toThrow('mean requires finite values (got NaN at index 3)');
    expect(() => mean([1, Number.POSITIVE_INFINITY])).toThrow('mean requires finite values (got Infinity at index 1)');
    expect(() => mean([])).toThrow(StatsError);
  });
});
