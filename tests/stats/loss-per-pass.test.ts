import { describe, expect, it } from 'vitest';
import { lossPerPass } from '@/lib/stats';
import { relativeError } from './support/lre';
import { twoPassFourStudRun } from './support/four-stud-runs';

describe('lossPerPass', () => {
  it('lossPerPass on the hand-worked 2-pass run: −12.5 N in pass 1 and −1.25 N in pass 2', () => {
    const [p1, p2] = lossPerPass(twoPassFourStudRun());
    // Pass 1 (hand): changes −25, −20, −5, 0 (studs 1, 3, 2, 4) -> mean −12.5 N;
    // percents −25, −21.0526…, −6.25, 0 -> mean −13.0757…
    expect(p1!.positions).toEqual([1, 3, 2, 4]);
    expect(p1!.meanChangeN).toBe(-12.5);
    expect(relativeError(p1!.meanChangePercent!, (-25 - (20 / 95) * 100 - 6.25 + 0) / 4)).toBeLessThan(1e-14);
    // Pass 2 (hand): 85 -> 82.5, 84 -> 82.5, 83.5 -> 82.5, 82.5 -> 82.5 -> mean (−2.5 − 1.5 − 1 + 0)/4 = −1.25 N.
    expect(p2!.meanChangeN).toBe(-1.25);
    expect(relativeError(p2!.meanChangePercent!, ((-2.5 / 85 - 1.5 / 84 - 1 / 83.5) * 100) / 4)).toBeLessThan(1e-14);
  });
});
