import { describe, expect, it } from 'vitest';
import { simulateRun, type SimulateRunInput } from '@/lib/sim/simulate-run';
import { simulateLibraryRun } from '@/lib/sim/from-library';
import { circularOrder } from '@/lib/sim/patterns';
import { studTransfers } from '@/lib/calc/tensioner-coverage';
import { sceneSetup, type Library } from '@/lib/classroom/scenes';

// A tensioner with no scatter: operator noise 0, actual LTF = nominal 1.15 (the floor of the tens1 rule,
// docs/REFERENCE.md §4), studs start at 0 N. Target 100 kN, medium gasket: c(1) = 0.07, c(2) = 0.035 (the
// simulator's invented model constants, lib/sim/MODEL.md), so every expected value below is worked by hand.
const exactTensioner = (studCount: number, coverage: 100 | 50, passes: number[]): SimulateRunInput => ({
  studCount,
  targetLoadN: 100_000,
  studDiameterM: 0.016,
  method: { tool: 'hydraulic_tensioner', coverage, passes: passes.map((percentOfTarget) => ({ percentOfTarget, order: circularOrder(studCount) })), checkPasses: 0 },
  lubricant: { nominalK: 0.15, kScatterCv: 0 },
  gasketStiffness: 'medium',
  seed: 7,
  operatorNoiseCv: 0,
  loadTransferFactorCv: 0,
  snugMaxFraction: 0,
});

describe('simulator: tensioner steps that cover several studs', () => {
  it('pulls every stud in one step per pass at 100 % coverage: applied 115 kN, residual 100 kN', () => {
    const { run } = simulateRun(exactTensioner(8, 100, [100, 100]));
    expect(run.steps.map((s) => [s.pass, s.covers?.map((c) => c.position)])).toEqual([[1, [1, 2, 3, 4, 5, 6, 7, 8]], [2, [1, 2, 3, 4, 5, 6, 7, 8]]]);
    // Applied = residual × LTF = 100 kN × 1.15; no stud is outside the step, so none eases.
    for (const cover of run.steps[0]!.covers!) {
      expect(cover.appliedN).toBeCloseTo(115_000, 6);
      expect(cover.residualN).toBeCloseTo(100_000, 6);
    }
    for (const load of run.steps[1]!.loadsN) expect(load).toBeCloseTo(100_000, 6);
  });

  it('pulls the odd then the even studs at 50 % coverage, and the first group eases by Σ c(k)·ΔF', () => {
    const { run } = simulateRun(exactTensioner(4, 50, [100]));
    expect(run.steps.map((s) => s.covers?.map((c) => c.position))).toEqual([[1, 3], [2, 4]]);
    // Step 2 raises studs 2 and 4 by 100 kN; studs 1 and 3 each have both at distance 1: 100 kN − 2 × 0.07 × 100 kN = 86 kN.
    const final = run.steps[1]!.loadsN;
    [86_000, 100_000, 86_000, 100_000].forEach((expected, i) => expect(final[i]).toBeCloseTo(expected, 6));
    // The report's per-stud transfer: the last pull of each stud, measured LTF 115 / 100 = 1.15.
    const transfers = studTransfers(run);
    expect(transfers.map((t) => t.position)).toEqual([1, 2, 3, 4]);
    for (const t of transfers) expect(t.measuredLtf).toBeCloseTo(1.15, 12);
    expect(transfers[0]!.residualN).toBeCloseTo(100_000, 6);
  });

  it("runs the Classroom's tensioning scene with every stud in one step per pass, on the same step model", () => {
    const joint = { id: 1, name: 'Rig', studCount: 8, targetLoadN: 50_000, bandPercent: 10, studDiameterM: 0.016 };
    const setup = sceneSetup('tool', { joints: [joint], methods: [], lubricants: [] } satisfies Library, 1)!;
    const tension = setup.sides.find((s) => s.key === 'tension')!;
    expect(tension.simMethod.coverage).toBe(100);
    const { run } = simulateLibraryRun({ joint, method: tension.simMethod, lubricant: tension.simLubricant, seed: 3 });
    expect(run.steps).toHaveLength(2);
    expect(run.steps.every((s) => s.covers?.length === 8)).toBe(true);
  });

  it('keeps one stud per step, each with its cover, when no coverage is given', () => {
    const base = exactTensioner(4, 100, [100]);
    const { run } = simulateRun({ ...base, method: { ...base.method, coverage: undefined } });
    expect(run.steps.map((s) => s.covers?.map((c) => c.position))).toEqual([[1], [2], [3], [4]]);
  });
});
