import { describe, expect, it } from 'vitest';
import { simulateRun, type SimulateRunInput } from '@/lib/sim/simulate-run';
import { coverageNeedsEvenStuds, LIBRARY_RUN_DEFAULTS, methodForSim, type LibraryMethodForSim } from '@/lib/sim/from-library';
import { SimInputError } from '@/lib/sim/errors';
import type { TensionerCoverage } from '@/lib/calc/tensioner-coverage';

// A library tensioner method simulated by its stored coverage. No scatter: operator noise 0, actual LTF =
// nominal, studs start at 0 N, target 100 kN, medium gasket: c(1) = 0.07, c(2) = 0.035 (the simulator's
// invented model constants, lib/sim/MODEL.md), so each expected value is worked by hand. The load transfer
// factor is the library's 1.15: the floor of the tens1 rule (docs/REFERENCE.md §4, as lib/sim/from-library.ts
// cites it); applied = residual × LTF (docs/REFERENCE.md §4). The 4-stud star 1-3-2-4 is common practice.
const libraryMethod = (toolKind: LibraryMethodForSim['toolKind'], tensionerCoverage: TensionerCoverage, studCount: number, order: number[]): LibraryMethodForSim => ({
  toolKind,
  tensionerCoverage,
  checkPasses: 0,
  passes: [{ percentOfTarget: 100, orderByStudCount: { [String(studCount)]: order } }],
});

const exact = (method: LibraryMethodForSim, studCount: number): SimulateRunInput => ({
  studCount,
  targetLoadN: 100_000,
  studDiameterM: 0.016,
  method: methodForSim(method, studCount),
  lubricant: { nominalK: 0.15, kScatterCv: 0 },
  gasketStiffness: 'medium',
  seed: 11,
  operatorNoiseCv: 0,
  loadTransferFactor: LIBRARY_RUN_DEFAULTS.loadTransferFactor,
  loadTransferFactorCv: 0,
  snugMaxFraction: 0,
});

describe('simulator: a library tensioner method by its coverage', () => {
  it('100 % coverage: one step per pass covering every stud, applied 115 kN and residual 100 kN each', () => {
    const { run } = simulateRun(exact(libraryMethod('hydraulic_tensioner', 'every_stud', 4, [1, 3, 2, 4]), 4));
    expect(run.steps).toHaveLength(1);
    expect(run.steps[0]!.covers!.map((c) => c.position)).toEqual([1, 2, 3, 4]);
    for (const cover of run.steps[0]!.covers!) {
      expect(cover.appliedN).toBeCloseTo(115_000, 6); // 100 kN × 1.15
      expect(cover.residualN).toBeCloseTo(100_000, 6);
    }
  });

  it('50 % coverage: the odd then the even studs; the odd ones ease by 2 × c(1) × 100 kN = 14 kN', () => {
    const { run } = simulateRun(exact(libraryMethod('hydraulic_tensioner', 'every_second_stud', 4, [1, 3, 2, 4]), 4));
    expect(run.steps.map((s) => s.covers!.map((c) => c.position))).toEqual([[1, 3], [2, 4]]);
    [86_000, 100_000, 86_000, 100_000].forEach((expected, i) => expect(run.steps[1]!.loadsN[i]).toBeCloseTo(expected, 6));
  });

  it('one tool: stud by stud in the stored order, each step one cover; the first stud eases by c(1) × 100 kN twice and c(2) × 100 kN once', () => {
    const { run } = simulateRun(exact(libraryMethod('hydraulic_tensioner', 'one_stud', 4, [1, 3, 2, 4]), 4));
    expect(run.steps.map((s) => s.position)).toEqual([1, 3, 2, 4]);
    expect(run.steps.every((s) => s.covers?.length === 1)).toBe(true);
    // Stud 1 loses 0.035 × 100 kN (stud 3, distance 2), then 0.07 × 100 kN for stud 2 and for stud 4 (distance 1): 100 − 3.5 − 7 − 7 = 82.5 kN.
    expect(run.steps[3]!.loadsN[0]).toBeCloseTo(82_500, 6);
  });

  it('keeps a torque method stud by stud whatever coverage it carries', () => {
    const method = methodForSim(libraryMethod('manual_torque_wrench', 'every_stud', 4, [1, 3, 2, 4]), 4);
    expect(method.coverage).toBeUndefined();
    const { run } = simulateRun({ ...exact(libraryMethod('manual_torque_wrench', 'one_stud', 4, [1, 3, 2, 4]), 4), method });
    expect(run.steps.map((s) => s.position)).toEqual([1, 3, 2, 4]);
  });

  it('refuses 50 % coverage on an odd stud count (no set on every second stud of 5)', () => {
    const method = libraryMethod('hydraulic_tensioner', 'every_second_stud', 5, [1, 2, 3, 4, 5]);
    expect(coverageNeedsEvenStuds(method, 5)).toBe(true);
    expect(() => methodForSim(method, 5)).toThrow(SimInputError);
  });
});
