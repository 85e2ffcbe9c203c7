import { describe, expect, it } from 'vitest';
import { runRelaxation } from '@/lib/analysis/relaxation';
import type { PassSummary } from '@/lib/analysis/types';
import { lbfToN } from '@/lib/calc/units';
import { elapsedSeconds, parseHoldReadings } from '@/lib/record/hold-readings';

const pass = (n: number, loadsAfterN: number[]): PassSummary => ({ pass: n, percentOfTarget: null, loadsAfterN, meanLossPercent: 0, cv: 0 });

describe('hold readings', () => {
  it('reads times in s, min and h (1 min = 60 s, 1 h = 3,600 s) and kN loads', () => {
    expect(elapsedSeconds('600')).toBe(600);
    expect(elapsedSeconds('10 min')).toBe(600);
    expect(elapsedSeconds('1,5 h')).toBe(5400);
    expect(elapsedSeconds('soon')).toBeNaN();
    const points = parseHoldReadings('elapsed,1,2,3,4\n0,80,81,82,83\n10 min,78,80,81,82\n1 h,76,79,80,81', { studCount: 4, passCount: 4, units: 'si' });
    expect(points.map((p) => p.elapsedS)).toEqual([0, 600, 3600]);
    expect(points.every((p) => p.afterPass === 4)).toBe(true);
    expect(points[2]!.loadsN).toEqual([76_000, 79_000, 80_000, 81_000]);
  });

  it('reads lbf (1 lbf = 4.4482216152605 N, exact) and an after_pass column', () => {
    const points = parseHoldReadings('elapsed;after_pass;stud 1;stud 2\n0;2;10000;10000', { studCount: 2, passCount: 3, units: 'us' });
    expect(points[0]!.afterPass).toBe(2);
    expect(points[0]!.loadsN[0]).toBeCloseTo(lbfToN(10_000), 9);
  });

  it('names the line of a bad row', () => {
    const opts = { studCount: 2, passCount: 3, units: 'si' as const };
    expect(() => parseHoldReadings('time,1,2\n0,1,1', opts)).toThrow('Hold readings, line 1: the first column must be "elapsed"');
    expect(() => parseHoldReadings('elapsed,1\n0,1', opts)).toThrow('there is no column for position 2');
    expect(() => parseHoldReadings('elapsed,1,2\n0,1,1\n10,1,-1', opts)).toThrow('line 3: position 2 needs a load of 0 or more.');
    expect(() => parseHoldReadings('elapsed,after_pass,1,2\n0,5,1,1', opts)).toThrow('line 2: after_pass must be a pass of this run, 1 to 3.');
    expect(() => parseHoldReadings('elapsed,1,2\n60,1,1\n1 min,1,1', opts)).toThrow('line 3: this time after this pass is already given');
  });
});

describe('runRelaxation', () => {
  it('gives % lost from the load at the end of the pass held after', () => {
    // Stud 1: (100 − 95)/100 = 5.0 %; stud 2: (80 − 78)/80 = 2.5 %; mean 3.75 % (by hand).
    const r = runRelaxation([pass(1, [50, 40]), pass(2, [100, 80])], [{ afterPass: 2, elapsedS: 3600, loadsN: [95, 78] }]);
    expect(r.holds[0]!.lostPercent).toEqual([5, 2.5]);
    expect(r.holds[0]!.meanLostPercent).toBeCloseTo(3.75, 12);
    expect(r.retighteningPasses).toEqual([]);
  });

  it('labels a pass after a hold a retightening pass', () => {
    const r = runRelaxation([pass(1, [100, 100]), pass(2, [100, 100]), pass(3, [100, 100])], [
      { afterPass: 3, elapsedS: 0, loadsN: [100, 100] },
      { afterPass: 2, elapsedS: 600, loadsN: [90, 92] },
    ]);
    expect(r.retighteningPasses).toEqual([3]);
    expect(r.holds.map((h) => h.afterPass)).toEqual([2, 3]);
  });
});
