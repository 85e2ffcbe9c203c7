import { describe, expect, it } from 'vitest';
import { loadTransferFactor } from '@/lib/calc/tensioner';
import { calculatorLtf, measuredLoadTransferFactors, stepPositions, studTransfers, tensionerStepGroups } from '@/lib/calc/tensioner-coverage';

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

describe('the step model: positions, per-stud transfer and the rule beside it', () => {
  it('reads the positions of a step from its covers, or its one position', () => {
    expect(stepPositions({ position: 3 })).toEqual([3]);
    expect(stepPositions({ position: 1, covers: [{ position: 1, appliedN: 1, residualN: 1 }, { position: 3, appliedN: 1, residualN: 1 }] })).toEqual([1, 3]);
  });

  it("keeps each stud's last pull (hand-worked: pass 2 applied 120 kN, kept 100 kN → 1.2)", () => {
    const step = (order: number, pass: number, covers: [number, number, number][]) => ({ order, pass, position: covers[0]![0], loadsN: [0, 0], covers: covers.map(([position, appliedN, residualN]) => ({ position, appliedN, residualN })) });
    const transfers = studTransfers({ steps: [step(2, 2, [[1, 120_000, 100_000], [2, 115_000, 0]]), step(1, 1, [[1, 60_000, 50_000]])] });
    expect(transfers).toEqual([
      { position: 1, appliedN: 120_000, residualN: 100_000, measuredLtf: 1.2, pass: 2 },
      { position: 2, appliedN: 115_000, residualN: 0, measuredLtf: null, pass: 2 },
    ]);
    expect(studTransfers({ steps: [{ order: 1, pass: 1, position: 1, loadsN: [1] }] })).toEqual([]);
  });

  it("gives the calculator's tens1 factor: 1.01 + 25.4/100 = 1.264, or the floor 1.15 without a clamped length (docs/REFERENCE.md §4)", () => {
    expect(calculatorLtf(25.4, 100).ltf).toBeCloseTo(1.264, 12);
    expect(calculatorLtf(25.4, 100).fromClampLength).toBe(true);
    expect(calculatorLtf(25.4, null)).toMatchObject({ ltf: 1.15, fromClampLength: false });
  });
});
