import { describe, expect, it } from 'vitest';
import { assignPasses, deriveSteps, type Snapshot } from '@/lib/ingest/derive-steps';

const target = 100_000; // N; threshold 2 % = 2 kN, noise band 0.1 % = 100 N

/** Builds snapshots from rows of kN values, lines from 10 upward, 1 s apart. */
function series(rows: number[][]): Snapshot[] {
  return rows.map((r, i) => ({ line: 10 + i, timeS: i, loadsN: r.map((x) => x * 1000) }));
}
const flat = (r: number[], n: number) => Array.from({ length: n }, () => [...r]);

describe('deriveSteps', () => {
  it('finds one step per single-stud rise and reads all studs at the peak', () => {
    const rows = [
      [0, 0, 0],
      [5, 0, 0],
      [10, 0, 0],
      ...flat([10, 0, 0], 5),
      [10, 0, 4],
      [9, 0, 8],
      ...flat([9, 0, 8], 5),
    ];
    const { steps, warnings } = deriveSteps(series(rows), 3, { targetLoadN: target });
    expect(warnings).toEqual([]);
    expect(steps.map((s) => [s.position, s.pass, s.lastLine, s.loadsN])).toEqual([
      [1, 1, 12, [10_000, 0, 0]], // peak on row 2 -> line 12
      [3, 1, 19, [9_000, 0, 8_000]], // peak on row 9 -> line 19
    ]);
    expect(steps[0]!.riseN).toBe(10_000);
    expect(steps[0]!.firstLine).toBe(10);
  });

  it('ignores rises below the threshold (1.5 kN < 2 % of 100 kN)', () => {
    const { steps } = deriveSteps(series([[0, 0], [1.5, 0], ...flat([1.5, 0], 6)]), 2, { targetLoadN: target });
    expect(steps).toEqual([]);
  });

  it('ends a rise when the stud falls back by more than the threshold, reading the peak', () => {
    const { steps } = deriveSteps(series([[0, 0], [20, 0], [30, 0], [25, 0], ...flat([25, 0], 6)]), 2, { targetLoadN: target });
    expect(steps).toHaveLength(1);
    expect(steps[0]!.loadsN).toEqual([30_000, 0]);
    expect(steps[0]!.lastLine).toBe(12);
  });

  it('ends a rise when another stud starts rising, without waiting to settle', () => {
    const { steps } = deriveSteps(series([[0, 0], [10, 0], [20, 0], [20, 10], [20, 20], ...flat([20, 20], 6)]), 2, { targetLoadN: target });
    expect(steps.map((s) => s.position)).toEqual([1, 2]);
    expect(steps.map((s) => s.loadsN)).toEqual([[20_000, 0], [20_000, 20_000]]);
  });

  it('does not count two studs rising together and warns with the line', () => {
    const { steps, warnings } = deriveSteps(series([[0, 0], [10, 10], ...flat([10, 10], 6)]), 2, { targetLoadN: target });
    expect(steps).toEqual([]);
    expect(warnings[0]).toMatch(/^Line 11: studs at positions 1, 2 rose together/);
  });

  it('starts a new pass when a stud tightened in the pass is tightened again', () => {
    expect(assignPasses([1, 3, 2, 4, 1, 3, 2, 4, 1])).toEqual([1, 1, 1, 1, 2, 2, 2, 2, 3]);
    expect(assignPasses([2, 2])).toEqual([1, 2]);
  });

  it('uses the pass column when the snapshots carry one', () => {
    const s = series([[0, 0], [10, 0], ...flat([10, 0], 5), [10, 10], ...flat([10, 10], 5)]).map((x, i) => ({ ...x, pass: i < 7 ? 3 : 4 }));
    expect(deriveSteps(s, 2, { targetLoadN: target }).steps.map((x) => x.pass)).toEqual([3, 4]);
  });

  it('honours a custom threshold and settle length', () => {
    const rows = [[0, 0], [1.5, 0], [1.5, 0], [1.5, 0]];
    expect(deriveSteps(series(rows), 2, { targetLoadN: target, thresholdFraction: 0.01, settleRows: 2 }).steps).toHaveLength(1);
  });
});
