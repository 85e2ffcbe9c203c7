import * as ss from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { sampleStandardDeviation } from '@/lib/stats';
import { relativeError } from './support/lre';
import { seededUniform } from './support/seeded-random';

describe('sampleStandardDeviation', () => {
  it('sampleStandardDeviation agrees with simple-statistics to 1e-13 on seeded random data', () => {
    for (let seed = 1; seed <= 20; seed++) {
      const x = seededUniform(seed * 7, 10 + seed, -5, 5);
      expect(relativeError(sampleStandardDeviation(x), ss.sampleStandardDeviation(x))).toBeLessThan(1e-13);
    }
  });

  it('sampleStandardDeviation is right for values near 1e300 and 1e-300, where squaring overflows or underflows', () => {
    // Hand: s of {a, 3a} is √2·a.
    expect(relativeError(sampleStandardDeviation([1e300, 3e300]), Math.SQRT2 * 1e300)).toBeLessThan(1e-15);
    expect(relativeError(sampleStandardDeviation([1e-300, 3e-300]), Math.SQRT2 * 1e-300)).toBeLessThan(1e-15);
    // simple-statistics: Infinity and 0 respectively (the failure this implementation avoids).
    expect(ss.sampleStandardDeviation([1e300, 3e300])).toBe(Number.POSITIVE_INFINITY);
    expect(ss.sampleStandardDeviation([1e-300, 3e-300])).toBe(0);
  });

  it('sampleStandardDeviation of constant data is 0 and of 1e9 + offsets equals that of the offsets', () => {
    expect(sampleStandardDeviation([5, 5, 5])).toBe(0);
    expect(relativeError(sampleStandardDeviation([1e9 + 0.1, 1e9 + 0.2, 1e9 + 0.3]), 0.1)).toBeLessThan(1e-6);
  });

  it('sampleStandardDeviation throws on one value and on NaN', () => {
    expect(() => sampleStandardDeviation([3])).toThrow('sampleStandardDeviation requires at least two values (got 1)');
    expect(() => sampleStandardDeviation([3, 4, Number.NaN])).toThrow('(got NaN at index 2)');
  });
});
