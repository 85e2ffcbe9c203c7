import { describe, expect, it } from 'vitest';
import { elasticInteractionDrift } from '@/lib/stats';
import { relativeError } from './support/lre';
import { onePassFourStudRun, twoPassFourStudRun } from './support/four-stud-runs';

describe('elasticInteractionDrift', () => {
  it('elasticInteractionDrift on the one-pass 4-stud run: early studs lose most (hand: −25 %, −6.25 %, −21.05 %, 0 %)', () => {
    const d = elasticInteractionDrift(onePassFourStudRun());
    // Hand: stud 1 100 -> 75; stud 2 80 -> 75; stud 3 95 -> 75; stud 4 75 -> 75.
    expect(d.map((s) => s.driftN)).toEqual([-25, -5, -20, 0]);
    expect(d.map((s) => s.lastTightenedStepOrder)).toEqual([1, 3, 2, 4]);
    expect(d[0]!.driftPercent).toBe(-25);
    expect(d[1]!.driftPercent).toBe(-6.25);
    expect(relativeError(d[2]!.driftPercent!, (-20 / 95) * 100)).toBeLessThan(1e-15);
    expect(d[3]!.driftPercent).toBe(0);
  });

  it('elasticInteractionDrift uses the last tightening: after pass 2 stud 1 drifts 85 -> 82.5 (hand)', () => {
    const d = elasticInteractionDrift(twoPassFourStudRun());
    expect(d[0]).toMatchObject({ position: 1, lastTightenedStepOrder: 5, loadAfterTighteningN: 85, finalLoadN: 82.5, driftN: -2.5 });
  });

  it('elasticInteractionDrift marks a stud the run never tightened with nulls', () => {
    const run = onePassFourStudRun();
    const d = elasticInteractionDrift({ ...run, steps: run.steps.slice(0, 2) });
    expect(d[1]).toEqual({ position: 2, lastTightenedStepOrder: null, loadAfterTighteningN: null, finalLoadN: -20, driftN: null, driftPercent: null });
  });
});
