import * as ss from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { sampleVariance, StatsError } from '@/lib/stats';
import { relativeError } from './support/lre';
import { seededUniform } from './support/seeded-random';

describe('sampleVariance', () => {
  it('sampleVariance agrees with simple-statistics to 1e-13 relative on seeded random loads', () => {
    for (let seed = 1; seed <= 20; seed++) {
      const x = seededUniform(seed, 30 + seed, 90_000, 110_000);
      // Reference: simple-statistics 7.12 `sampleVariance` (plain two-pass, fine for such data).
      expect(relativeError(sampleVariance(x), ss.sampleVariance(x))).toBeLessThan(1e-13);
    }
  });

  it('sampleVariance of 1e9 + offsets matches the variance of the offsets', () => {
    // Hand: offsets 0.1, 0.2, 0.3 have variance 0.01; doubles near 1e9 hold them to ~1e-7, so 1e-6 relative.
    const x = [1e9 + 0.1, 1e9 + 0.2, 1e9 + 0.3];
    expect(relativeError(sampleVariance(x), 0.01)).toBeLessThan(1e-6);
  });

  it('sampleVariance of constant data is exactly 0 and of two values is (a − b)²/2', () => {
    expect(sampleVariance([7.3, 7.3, 7.3, 7.3])).toBe(0); // hand
    expect(sampleVariance([1, 3])).toBe(2); // hand: (1 − 3)²/2
  });

  it('sampleVariance of tiny 1e-300 values does not underflow to 0', () => {
    // Hand: variance of {1, 3}·1e-300 is 2e-600, below the double range -> 0 is correct; of {1, 3}·1e-150 it is 2e-300.
    expect(relativeError(sampleVariance([1e-150, 3e-150]), 2e-300)).toBeLessThan(1e-15);
    expect(ss.sampleVariance([1e-170, 3e-170])).toBe(0); // simple-statistics squares before scaling
    expect(relativeError(sampleVariance([1e-170, 3e-170]), 2e-340)).toBeLessThan(1e-10); // subnormal result, fewer digits
  });

  it('sampleVariance returns Infinity only when the variance itself exceeds the double range', () => {
    expect(sampleVariance([1e300, 3e300])).toBe(Number.POSITIVE_INFINITY); // hand: 2e600 overflows
    expect(relativeError(sampleVariance([1e150, 3e150]), 2e300)).toBeLessThan(1e-15);
  });

  it('sampleVariance throws StatsError on one value, empty input and NaN', () => {
    expect(() => sampleVariance([1])).toThrow(new StatsError('sampleVariance requires at least two values (got 1)'));
    expect(() => sampleVariance([])).toThrow('sampleVariance requires at least two values');
    expect(() => sampleVariance([1, Number.NaN])).toThrow('sampleVariance requires finite values (got NaN at index 1)');
  });
});
