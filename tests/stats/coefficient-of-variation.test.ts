import * as ss from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { coefficientOfVariation } from '@/lib/stats';
import { relativeError } from './support/lre';
import { seededUniform } from './support/seeded-random';

describe('coefficientOfVariation', () => {
  it('coefficientOfVariation of 90, 100, 110 is 0.1 (hand: s = 10, mean = 100)', () => {
    expect(relativeError(coefficientOfVariation([90, 100, 110]), 0.1)).toBeLessThan(1e-15);
  });

  it('coefficientOfVariation agrees with simple-statistics on seeded loads', () => {
    const x = seededUniform(11, 24, 95_000, 105_000);
    // simple-statistics coefficientOfVariation = sampleStandardDeviation/mean.
    expect(relativeError(coefficientOfVariation(x), ss.coefficientOfVariation(x))).toBeLessThan(1e-13);
  });

  it('coefficientOfVariation is 0 for constant loads and throws for a zero mean, one value or NaN', () => {
    expect(coefficientOfVariation([100, 100, 100])).toBe(0);
    expect(() => coefficientOfVariation([-1, 1])).toThrow('coefficientOfVariation requires a non-zero mean');
    expect(() => coefficientOfVariation([1])).toThrow('coefficientOfVariation requires at least two values (got 1)');
    expect(() => coefficientOfVariation([1, Number.NaN])).toThrow('(got NaN at index 1)');
  });
});
