import { describe, expect, it } from 'vitest';
import { interactionCoefficients } from '@/lib/stats';
import type { NormalisedRun } from '@/lib/record/run-types';
import { twoPassFourStudRun } from './support/four-stud-runs';

describe('interactionCoefficients', () => {
  it('interactionCoefficients recovers c1 = −0.1 and c2 = −0.05 from the exact 4-stud run, SE ~0', () => {
    // Model used to build the run (see support/four-stud-runs.ts): neighbours −0.1Δ, opposite −0.05Δ.
    const r = interactionCoefficients(twoPassFourStudRun(), { initialLoadsN: [0, 0, 0, 0] });
    expect(r.stepsUsed).toBe(8);
    const [k0, k1, k2] = r.byDistance;
    expect(k0).toEqual({ distance: 0, coefficient: 1, standardError: 0, observations: 8 });
    expect(Math.abs(k1!.coefficient + 0.1)).toBeLessThan(1e-9 * 0.1);
    expect(Math.abs(k2!.coefficient + 0.05)).toBeLessThan(1e-9 * 0.05);
    // 8 steps x 2 neighbours, 8 steps x 1 opposite stud.
    expect(k1!.observations).toBe(16);
    expect(k2!.observations).toBe(8);
    expect(k1!.standardError!).toBeLessThan(1e-12);
    expect(k2!.standardError!).toBeLessThan(1e-12);
  });

  it('interactionCoefficients without initial loads skips the first step and still recovers the model', () => {
    const r = interactionCoefficients(twoPassFourStudRun());
    expect(r.stepsUsed).toBe(7);
    expect(Math.abs(r.byDistance[1]!.coefficient + 0.1)).toBeLessThan(1e-10);
  });

  it('interactionCoefficients on a 6-stud ring: circular distance treats studs 1 and 6 as neighbours', () => {
    // Hand-built: tightening stud 1 by 100 from zero moves stud 2 and stud 6 by −8 (c1 = −0.08), 3 and 5 by −3
    // (c2 = −0.03), stud 4 by −1 (c3 = −0.01). Then stud 4 by 100 moves 3, 5 by −8; 2, 6 by −3; 1 by −1.
    const run: NormalisedRun = {
      studCount: 6,
      targetLoadN: 100,
      steps: [
        { order: 1, pass: 1, position: 1, loadsN: [100, -8, -3, -1, -3, -8] },
        { order: 2, pass: 1, position: 4, loadsN: [99, -11, -11, 99, -11, -11] },
      ],
    };
    const r = interactionCoefficients(run, { initialLoadsN: [0, 0, 0, 0, 0, 0] });
    expect(r.byDistance.map((b) => b.distance)).toEqual([0, 1, 2, 3]);
    expect(Math.abs(r.byDistance[1]!.coefficient + 0.08)).toBeLessThan(1e-12);
    expect(Math.abs(r.byDistance[2]!.coefficient + 0.03)).toBeLessThan(1e-12);
    expect(Math.abs(r.byDistance[3]!.coefficient + 0.01)).toBeLessThan(1e-12);
  });

  it('interactionCoefficients gives a positive SE when neighbours do not follow one coefficient', () => {
    // Hand: two observations at distance 1 per step; x = 100, y = −8 and −12 -> c1 = −0.1,
    // SSR = 2·2² = 8 per step.
    const run: NormalisedRun = {
      studCount: 4,
      targetLoadN: 100,
      steps: [{ order: 1, pass: 1, position: 1, loadsN: [100, -8, -5, -12] }],
    };
    const r = interactionCoefficients(run, { initialLoadsN: [0, 0, 0, 0] });
    expect(Math.abs(r.byDistance[1]!.coefficient + 0.1)).toBeLessThan(1e-15);
    // SE = √(SSR/(m − 1)/Σx²) = √(8/1/20000) = 0.02 (hand).
    expect(Math.abs(r.byDistance[1]!.standardError! - 0.02)).toBeLessThan(1e-15);
  });

  it('interactionCoefficients throws when no step has an earlier snapshot or initial loads are the wrong length', () => {
    const run = twoPassFourStudRun();
    expect(() => interactionCoefficients({ ...run, steps: run.steps.slice(0, 1) })).toThrow(
      'interactionCoefficients requires at least one step with an earlier snapshot',
    );
    expect(() => interactionCoefficients(run, { initialLoadsN: [0, 0, 0] })).toThrow(
      'interactionCoefficients requires initialLoadsN with 4 values (got 3)',
    );
  });
});
