import { describe, expect, it } from 'vitest';
import { finalLoads, StatsError } from '@/lib/stats';
import { twoPassFourStudRun } from './support/four-stud-runs';

describe('finalLoads', () => {
  it('finalLoads returns the last snapshot of the hand-worked 4-stud run (82.5 N each)', () => {
    expect(finalLoads(twoPassFourStudRun())).toEqual([82.5, 82.5, 82.5, 82.5]);
  });
  it('finalLoads returns a copy, not the run’s own array', () => {
    const run = twoPassFourStudRun();
    finalLoads(run)[0] = -1;
    expect(run.steps[7]!.loadsN[0]).toBe(82.5);
  });
  it('finalLoads rejects a run without steps, a short snapshot and a NaN load', () => {
    const run = twoPassFourStudRun();
    expect(() => finalLoads({ ...run, steps: [] })).toThrow(new StatsError('finalLoads requires a run with at least one step'));
    expect(() => finalLoads({ ...run, steps: [{ order: 1, pass: 1, position: 1, loadsN: [1, 2, 3] }] })).toThrow(
      'finalLoads requires 4 loads per step (step 1 has 3)',
    );
    expect(() => finalLoads({ ...run, steps: [{ order: 1, pass: 1, position: 1, loadsN: [1, Number.NaN, 3, 4] }] })).toThrow(
      'finalLoads requires finite loads (got NaN at step 1, position 2)',
    );
    expect(() => finalLoads({ ...run, steps: [{ order: 1, pass: 1, position: 5, loadsN: [1, 2, 3, 4] }] })).toThrow(
      'finalLoads requires positions from 1 to 4 (step 1 has position 5)',
    );
  });
});
