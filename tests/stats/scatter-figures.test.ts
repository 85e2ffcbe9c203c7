import * as ss from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import {
  largestDeviationFromMean,
  largestDeviationFromTarget,
  rangeOverMean,
  shareWithinBand,
  threeSigmaOverMean,
  tighteningFactor,
  valueExtent,
} from '@/lib/stats';
import { relativeError } from './support/lre';
import { seededUniform } from './support/seeded-random';

// One file for the small scatter figures built on mean/extent; each describe is one function.

describe('valueExtent', () => {
  it('valueExtent matches simple-statistics min/max on seeded data and reports first indices', () => {
    const x = seededUniform(3, 40, 0, 1);
    const e = valueExtent(x);
    expect(e.min).toBe(ss.min(x));
    expect(e.max).toBe(ss.max(x));
    expect(e.range).toBe(ss.max(x) - ss.min(x));
    expect(valueExtent([3, 1, 4, 1, 5])).toEqual({ min: 1, max: 5, range: 4, minIndex: 1, maxIndex: 4 }); // hand
  });
  it('valueExtent throws on empty input and NaN', () => {
    expect(() => valueExtent([])).toThrow('valueExtent requires at least one value');
    expect(() => valueExtent([1, Number.NaN])).toThrow('valueExtent requires finite values (got NaN at index 1)');
  });
});

describe('rangeOverMean', () => {
  it('rangeOverMean of 90, 100, 110 is 0.2 (hand)', () => {
    expect(relativeError(rangeOverMean([90, 100, 110]), 0.2)).toBeLessThan(1e-15);
  });
  it('rangeOverMean throws for a zero mean', () => {
    expect(() => rangeOverMean([-1, 1])).toThrow('rangeOverMean requires a non-zero mean');
  });
});

describe('largestDeviationFromMean', () => {
  it('largestDeviationFromMean finds the stud 25 % above the mean (hand: mean 100)', () => {
    expect(largestDeviationFromMean([90, 100, 125, 85])).toEqual({ index: 2, value: 125, deviation: 25, percent: 25, mean: 100 });
  });
  it('largestDeviationFromMean keeps the sign of a low stud', () => {
    const r = largestDeviationFromMean([100, 100, 100, 60]); // hand: mean 90, 60 is −30 = −33.3 %
    expect(r.index).toBe(3);
    expect(relativeError(r.percent, -100 / 3)).toBeLessThan(1e-14);
  });
});

describe('largestDeviationFromTarget', () => {
  it('largestDeviationFromTarget reports +8 % for 108 against target 100 (hand)', () => {
    expect(largestDeviationFromTarget([95, 108, 101], 100)).toEqual({ index: 1, value: 108, deviation: 8, percent: 8 });
  });
  it('largestDeviationFromTarget throws on a zero or NaN target', () => {
    expect(() => largestDeviationFromTarget([1], 0)).toThrow('largestDeviationFromTarget requires a non-zero target');
    expect(() => largestDeviationFromTarget([1], Number.NaN)).toThrow('largestDeviationFromTarget requires a finite target (got NaN)');
  });
});

describe('shareWithinBand', () => {
  it('shareWithinBand counts boundaries as inside (hand: 90 and 110 are inside ±10 % of 100)', () => {
    expect(shareWithinBand([90, 110, 89.9, 110.1], 100, 10)).toMatchObject({ count: 2, n: 4, share: 0.5 });
    expect(shareWithinBand([95, 100, 111, 89], 100, 10).share).toBe(0.5);
  });
  it('shareWithinBand throws on a non-positive band', () => {
    expect(() => shareWithinBand([1], 100, 0)).toThrow('shareWithinBand requires a positive bandPercent (got 0)');
  });
});

describe('tighteningFactor', () => {
  it('tighteningFactor αA = 1.6 implies ±23 % (docs/REFERENCE.md §5 worked check, computed there)', () => {
    const r = tighteningFactor([80, 100, 128]);
    expect(relativeError(r.alphaA, 1.6)).toBeLessThan(1e-15);
    expect(Math.round(r.plusMinusScatter * 100)).toBe(23);
    expect(relativeError(r.plusMinusScatter, 0.6 / 2.6)).toBeLessThan(1e-15); // hand: (1.6 − 1)/(1.6 + 1)
  });
  it('tighteningFactor throws on a non-positive load', () => {
    expect(() => tighteningFactor([10, 0])).toThrow('tighteningFactor requires positive values (got 0 at index 1)');
  });
});

describe('threeSigmaOverMean', () => {
  it('threeSigmaOverMean of 90, 100, 110 is 0.3 (hand: 3·10/100)', () => {
    expect(relativeError(threeSigmaOverMean([90, 100, 110]), 0.3)).toBeLessThan(1e-15);
  });
  it('threeSigmaOverMean throws on one value', () => {
    expect(() => threeSigmaOverMean([1])).toThrow('threeSigmaOverMean requires at least two values (got 1)');
  });
});
