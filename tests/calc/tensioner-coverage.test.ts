import { describe, expect, it } from 'vitest';
import { loadTransferFactor } from '@/lib/calc/tensioner';
import { measuredLoadTransferFactors, tensionerStepGroups } from '@/lib/calc/tensioner-coverage';

describe('tensioner step groups (100 % and 50 % tool coverage, common practice)', () => {
  it('takes every stud in one step at 100 %', () => {
    expect(tensionerStepGroups(8, 100)).toEqual([[1, 2, 3, 4, 5, 6, 7, 8]]);
  });

  it('takes every other stud at 50 %: odd positions, then even', () => {
    expect(tensionerStepGroups(8, 50)).toEqual([[1, 3, 5, 7], [2, 4, 6, 8]]);
  });

  it('refuses 50 % on an odd stud count', () => {
    expect(() => tensionerStepGroups(7, 50)).toThrow('50 % tool coverage needs an even number of studs.');
  });
});

describe('measured load transfer factor (applied / residual, docs/REFERENCE.md §4)', () => {
  it('is applied over residual per stud, beside the rule', () => {
    // 126.4 kN applied, 100 kN kept: 1.264 (by hand), the tens1 rule for D = 25.4 mm, L = 100 mm (1.01 + 0.254).
    const measured = measuredLoadTransferFactors([126_400, 115_000], [100_000, 100_000]);
    expect(measured[0]).toBeCloseTo(loadTransferFactor('tens1', 25.4, 100), 12);
    expect(measured[1]).toBeCloseTo(1.15, 12);
  });

  it('gives null for a stud with no residual load', () => {
    expect(measuredLoadTransferFactors([10, 10], [0, 8])).toEqual([null, 1.25]);
  });
});
