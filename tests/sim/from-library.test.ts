import { describe, expect, it } from 'vitest';
import { lubricantForSim, methodForSim, passWithoutOrder, simulateLibraryRun, simToolOf, type LibraryMethodForSim } from '@/lib/sim/from-library';
import { crossPatternOrder } from '@/lib/sim/patterns';
import { simulateRun } from '@/lib/sim/simulate-run';
import { SimInputError } from '@/lib/sim/errors';

// A 5/8-11 joint: D = 0.625 in = 0.015875 m exactly (1 in = 25.4 mm); target 52.78 kN as in tests/lib/classroom-scenes.test.ts.
const joint = { studCount: 8, targetLoadN: 52_780, studDiameterM: 0.015875 };
const threePass: LibraryMethodForSim = {
  toolKind: 'manual_torque_wrench',
  checkPasses: 1,
  passes: [30, 60, 100].map((percentOfTarget) => ({ percentOfTarget, orderByStudCount: { '8': crossPatternOrder(8) } })),
};

describe('lubricantForSim (a library lubricant stores only its nominal K)', () => {
  it('keeps the nominal K and scatters a dry K of 0.20 (Shigley "condition unknown", docs/REFERENCE.md §3 ✓ [SHIG]) more than pastes', () => {
    const [dry, copper, moly] = [0.2, 0.15, 0.12].map((k) => lubricantForSim({ nominalNutFactor: k }));
    expect([dry!.nominalK, copper!.nominalK, moly!.nominalK]).toEqual([0.2, 0.15, 0.12]);
    expect(dry!.kScatterCv).toBeGreaterThan(copper!.kScatterCv);
    expect(copper!.kScatterCv).toBeGreaterThanOrEqual(moly!.kScatterCv);
    expect(dry!.runToRunCv!).toBeGreaterThan(moly!.runToRunCv!);
  });
});

describe('methodForSim', () => {
  it("takes the method's order for the stud count and simulates a tool kind of 'other' as a manual wrench", () => {
    const method = methodForSim({ ...threePass, toolKind: 'other' }, 8);
    expect(method.tool).toBe('manual_torque_wrench');
    expect(method.passes.map((p) => p.order)).toEqual([crossPatternOrder(8), crossPatternOrder(8), crossPatternOrder(8)]);
    expect(simToolOf('hydraulic_tensioner')).toBe('hydraulic_tensioner');
  });

  it('names the first pass without an order for the stud count', () => {
    expect(passWithoutOrder(threePass, 8)).toBeNull();
    expect(passWithoutOrder(threePass, 12)).toBe(1);
    expect(() => methodForSim(threePass, 12)).toThrow(SimInputError);
  });
});

describe('simulateLibraryRun', () => {
  it('runs the simulator with the settings the library does not store: medium gasket, LTF 1.15 (lib/sim/MODEL.md)', () => {
    const method = methodForSim(threePass, 8);
    const lubricant = lubricantForSim({ nominalNutFactor: 0.15 });
    const viaAdapter = simulateLibraryRun({ joint, method, lubricant, seed: 11 });
    const direct = simulateRun({ ...joint, method, lubricant, gasketStiffness: 'medium', loadTransferFactor: 1.15, seed: 11 });
    expect(viaAdapter).toEqual(direct);
    expect(simulateLibraryRun({ joint, method, lubricant, seed: 11, gasketStiffness: 'stiff' }).run).not.toEqual(direct.run);
  });
});
