import { describe, expect, it } from 'vitest';
import { summariseRun } from '@/lib/stats';
import type { NormalisedRun } from '@/lib/record/run-types';
import { relativeError } from './support/lre';

// Final loads 98.0, 101.5, 99.0, 100.2 kN against a 100 kN target, band ±5 %. Hand arithmetic:
// mean 99 675 N; deviations −1675, 1825, −675, 525; Σd² = 6 867 500; s = √(6 867 500/3).
const run: NormalisedRun = {
  studCount: 4,
  targetLoadN: 100_000,
  steps: [{ order: 1, pass: 1, position: 4, loadsN: [98_000, 101_500, 99_000, 100_200] }],
};

describe('summariseRun', () => {
  it('summariseRun returns the hand-computed final-load figures', () => {
    const s = summariseRun(run, { bandPercent: 5 });
    const sd = Math.sqrt(6_867_500 / 3);
    expect(relativeError(s.meanN, 99_675)).toBeLessThan(1e-15);
    expect(relativeError(s.sdN, sd)).toBeLessThan(1e-14);
    expect(relativeError(s.cv, sd / 99_675)).toBeLessThan(1e-14);
    expect(relativeError(s.rangeOverMean, 3_500 / 99_675)).toBeLessThan(1e-14);
    expect(s.largestDeviationFromTargetPercent).toBe(-2); // 98 000 is 2 % below target
    expect(s.largestDeviationPosition).toBe(1);
    expect(s.shareWithinBand).toBe(1);
    expect(relativeError(s.cp!, 10_000 / (6 * sd))).toBeLessThan(1e-14);
    expect(relativeError(s.cpk!, 4_675 / (3 * sd))).toBeLessThan(1e-14); // min(105 000 − 99 675, 99 675 − 95 000)
  });

  it('summariseRun throws without a positive band', () => {
    expect(() => summariseRun(run, { bandPercent: 0 })).toThrow('summariseRun requires a positive bandPercent (got 0)');
  });
});
