import { expect } from 'vitest';
import { relativeError } from './lre';

interface ComputedPair {
  groupA: number;
  groupB: number;
  meanDifference: number;
  pValue: number;
  confidenceInterval: { lower: number; upper: number };
}

interface ReferencePair {
  groupA: number;
  groupB: number;
  meanDifference: number;
  pValue: number;
  lower: number;
  upper: number;
}

/**
 * Checks pairwise comparisons (Tukey–Kramer, Games–Howell) against reference pairs: same pairs in
 * order; mean differences to 1e-10 relative (a difference of two ~1e5 N means leaves ~1e-11 after
 * cancellation); p-values to 1e-7 relative or 1e-9 absolute, because the studentized range here is
 * jstat's port of R's ptukey, observed to agree with scipy.stats.studentized_range to ~1e-8; interval
 * end points to 1e-8 of the interval width (they can sit near 0, where relative error is meaningless).
 */
export function expectPairsToMatch(computed: readonly ComputedPair[], reference: readonly ReferencePair[]): void {
  expect(computed).toHaveLength(reference.length);
  computed.forEach((c, i) => {
    const e = reference[i]!;
    expect([c.groupA, c.groupB]).toEqual([e.groupA, e.groupB]);
    expect(relativeError(c.meanDifference, e.meanDifference)).toBeLessThan(1e-10);
    expect(Math.abs(c.pValue - e.pValue)).toBeLessThan(Math.max(1e-9, 1e-7 * e.pValue));
    const width = e.upper - e.lower;
    expect(Math.abs(c.confidenceInterval.lower - e.lower)).toBeLessThan(1e-8 * width);
    expect(Math.abs(c.confidenceInterval.upper - e.upper)).toBeLessThan(1e-8 * width);
  });
}
