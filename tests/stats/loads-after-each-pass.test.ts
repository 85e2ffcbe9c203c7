import { describe, expect, it } from 'vitest';
import { loadsAfterEachPass } from '@/lib/stats';
import { twoPassFourStudRun } from './support/four-stud-runs';

describe('loadsAfterEachPass', () => {
  it('loadsAfterEachPass gives the snapshot after each pass’s last step (hand-worked run: 75 N then 82.5 N)', () => {
    expect(loadsAfterEachPass(twoPassFourStudRun())).toEqual([
      { pass: 1, lastStepOrder: 4, loadsN: [75, 75, 75, 75] },
      { pass: 2, lastStepOrder: 8, loadsN: [82.5, 82.5, 82.5, 82.5] },
    ]);
  });
  it('loadsAfterEachPass rejects passes that go backwards', () => {
    const run = twoPassFourStudRun();
    const steps = run.steps.map((s, i) => (i === 5 ? { ...s, pass: 1 } : s));
    expect(() => loadsAfterEachPass({ ...run, steps })).toThrow(
      'loadsAfterEachPass requires non-decreasing pass numbers from 1 (step 6 has pass 1)',
    );
  });
});
