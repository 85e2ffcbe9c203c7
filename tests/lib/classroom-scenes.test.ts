import { describe, expect, it } from 'vitest';
import { placeAmongSimulated, sceneFigures } from '@/lib/classroom/figures';
import { findMethod, moveScene, parseSceneOrder, sceneSetup, seedFamily, simulateSide, toggleScene, type Library } from '@/lib/classroom/scenes';
import { lubricantForSim } from '@/lib/sim/from-library';
import { circularOrder, crossPatternOrder } from '@/lib/sim/patterns';

// A 5/8-11 B7 joint at 50 % of 105 ksi on As = 0.226 in² (docs/REFERENCE.md §1 ✓ [EE-AREA], §2 ✓ [NANL]), computed.
const TARGET_N = 52_780;
const orders = (pattern: 'cross' | 'circular') => ({ '8': pattern === 'cross' ? crossPatternOrder(8) : circularOrder(8) });
const library: Library = {
  joints: [{ id: 7, name: 'Training joint', studCount: 8, targetLoadN: TARGET_N, bandPercent: 10, studDiameterM: 0.015875 }],
  methods: [
    { id: 1, name: 'One cross', toolKind: 'manual_torque_wrench', checkPasses: 0, passes: [{ percentOfTarget: 100, pattern: 'cross', orderByStudCount: orders('cross') }] },
    { id: 2, name: 'Three cross + check', toolKind: 'manual_torque_wrench', checkPasses: 1, passes: [30, 60, 100].map((p) => ({ percentOfTarget: p, pattern: 'cross' as const, orderByStudCount: orders('cross') })) },
    { id: 3, name: 'One circle', toolKind: 'manual_torque_wrench', checkPasses: 0, passes: [{ percentOfTarget: 100, pattern: 'circular', orderByStudCount: orders('circular') }] },
    { id: 4, name: 'Tensioner', toolKind: 'hydraulic_tensioner', tensionerCoverage: 'every_stud', checkPasses: 0, passes: [100, 100].map((p) => ({ percentOfTarget: p, pattern: 'cross' as const, orderByStudCount: orders('cross') })) },
  ],
  lubricants: [
    { id: 10, name: 'Dry', nominalNutFactor: 0.2 },
    { id: 11, name: 'Moly paste', nominalNutFactor: 0.12 },
  ],
};

describe('scene order in the URL', () => {
  it('keeps known scenes in the given order, drops unknown and repeated ones, and falls back to all', () => {
    expect(parseSceneOrder('lube,passes,bogus,lube')).toEqual(['lube', 'passes']);
    expect(parseSceneOrder('')).toEqual(['passes', 'pattern', 'lube', 'tool', 'real']);
    expect(parseSceneOrder(undefined)).toHaveLength(5);
  });
  it('moves a scene up and down and never leaves the list empty', () => {
    expect(moveScene(['passes', 'pattern', 'lube'], 2, -1)).toEqual(['passes', 'lube', 'pattern']);
    expect(moveScene(['passes', 'pattern'], 0, -1)).toEqual(['passes', 'pattern']);
    expect(toggleScene(['passes'], 'passes')).toEqual(['passes']);
    expect(toggleScene(['passes'], 'real')).toEqual(['passes', 'real']);
  });
});

describe('scene setup from the library', () => {
  it('chooses existing library rows for each side so saved runs reference real rows', () => {
    const passes = sceneSetup('passes', library, 7)!;
    expect(passes.sides.map((s) => s.methodId)).toEqual([1, 2]);
    expect(passes.sides.map((s) => s.lubricantId)).toEqual([11, 11]);
    expect(passes.missing).toEqual([]);
    expect(sceneSetup('lube', library, 7)!.sides.map((s) => s.lubricantId)).toEqual([10, 11]);
    expect(sceneSetup('tool', library, 7)!.sides.map((s) => s.methodId)).toEqual([2, 4]);
    // The tensioning side pulls every stud at once: a tensioner method moved stud by stud is not that method.
    const oneTool = sceneSetup('tool', { ...library, methods: library.methods.map((m) => (m.id === 4 ? { ...m, tensionerCoverage: 'one_stud' as const } : m)) }, 7)!;
    expect(oneTool.sides[1]!.methodId).toBeNull();
    expect(oneTool.sides[1]!.simMethod.coverage).toBe(100);
    expect(oneTool.missing.length).toBeGreaterThan(0);
    expect(sceneSetup('passes', library, 99)).toBeNull();
  });
  it('says which row is missing and still runs the scene on built-in settings', () => {
    const setup = sceneSetup('pattern', { ...library, methods: library.methods.filter((m) => m.id !== 3) }, 7)!;
    expect(setup.sides[1]!.methodId).toBeNull();
    expect(setup.missing[0]).toContain('circular');
    expect(simulateSide(setup.sides[1]!, setup.joint, 1).steps.map((s) => s.position)).toEqual(circularOrder(8));
    expect(findMethod(library.methods, { tool: 'hydraulic_torque_wrench', passes: [{ percentOfTarget: 100, pattern: 'cross' }], checkPasses: 0 }, 8)).toBeNull();
  });
  it('treats a K of 0.20 as dry (Shigley "unknown condition", docs/REFERENCE.md §3 ✓ [SHIG]) and scatters it more than a paste', () => {
    expect(lubricantForSim({ nominalNutFactor: 0.2 }).kScatterCv).toBeGreaterThan(lubricantForSim({ nominalNutFactor: 0.12 }).kScatterCv);
  });
  it('uses the same seed family on both sides', () => {
    expect(seedFamily(5, 3)).toEqual([5, 6, 7]);
  });
});

describe('scene end figures (over 30 simulated runs each)', () => {
  const figuresOf = (scene: 'passes' | 'pattern' | 'lube' | 'tool') => {
    const setup = sceneSetup(scene, library, 7)!;
    return sceneFigures(setup.sides.map((side) => ({ key: side.key, label: side.label, runs: seedFamily(1).map((seed) => simulateSide(side, setup.joint, seed)) })), 10, 'these methods');
  };
  it('shows several passes more even than one pass, with a reading that finds the difference (docs/REFERENCE.md §4 ✓ [HENNIG], [HSW], [BSCI])', () => {
    const f = figuresOf('passes');
    expect(f.basis).toBe('over 30 simulated runs each');
    expect(f.title).toBe('Final loads, mean over 30 simulated runs each');
    expect(f.sides[1]!.cv).toBeLessThan(f.sides[0]!.cv);
    expect(f.sides[0]!.meanDriftPercent).toBeLessThan(f.sides[1]!.meanDriftPercent);
    expect(f.cvReading).toMatch(/^Run CV differs between these methods at the 5 % level \(Welch's ANOVA on ln run CV/);
    expect(f.scatterReading).toMatch(/^Within-run scatter differs between these methods at the 5 % level \(Welch's ANOVA on within-run SD/);
  });
  it('shows a cross pass more even than a circular one (the simulator’s flange rotation term, lib/sim/MODEL.md)', () => {
    const f = figuresOf('pattern');
    expect(f.sides[0]!.cv).toBeLessThan(f.sides[1]!.cv);
  });
  it('shows lubricated more even than dry under torque control (docs/REFERENCE.md §5: torque dry ±35 %, lubricated ±25 % ✓ [SPRING])', () => {
    const f = figuresOf('lube');
    expect(f.sides[1]!.cv).toBeLessThan(f.sides[0]!.cv);
  });
  it('places a real run among the simulated ones in words', () => {
    expect(placeAmongSimulated(0.05, [0.02, 0.04, 0.06, 0.08])).toBe("The measured run's CV (5.0 %) is higher than 2 of the 4 simulated runs: it lies within what the model gives for this method.");
    expect(placeAmongSimulated(0.1, [0.02])).toMatch(/higher than all 1/);
  });
});
