/**
 * The stud of a check-pass step in a long file (one snapshot of every stud per time stamp, no step
 * column): a check pass moves no load, so no stud "rose most". With the method's steps the stud comes
 * from the method's order, confirmed by the snapshot (the stud is already at load); without them it
 * is a guess and a warning says so. The file below is made by hand: a 4-stud joint, target 100 kN,
 * one cross pass 1-3-2-4 to 100 kN (each pull relaxes the studs pulled before by 2 kN), then a
 * circular check pass 1-2-3-4 that finds every nut at load. Expected positions are the file's own
 * construction (computed by hand); the rule is ours (lib/ingest/readers/steps.ts, `planStud`).
 */
import { describe, expect, it } from 'vitest';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import { planStud } from '@/lib/ingest/readers/steps';
import type { JointForImport } from '@/lib/ingest/normalise';

const stamps: number[][] = [
  [0, 0, 0, 0], // at rest
  [100, 0, 0, 0], // stud 1
  [98, 0, 100, 0], // stud 3
  [96, 100, 98, 0], // stud 2
  [94, 98, 96, 100], // stud 4
  [94, 98, 96, 100], // check 1
  [94, 98, 96, 100], // check 2
  [94, 98, 96, 100], // check 3
  [94, 98, 96, 100], // check 4
];
const text = ['time_s,stud,load_kN', ...stamps.flatMap((loads, i) => loads.map((kN, k) => `${i * 10},${k + 1},${kN.toFixed(3)}`))].join('\n') + '\n';

const CROSS = [1, 3, 2, 4];
const plannedSteps = [...CROSS.map((position) => ({ pass: 1, position, check: false })), ...[1, 2, 3, 4].map((position) => ({ pass: 2, position, check: true }))];
const joint: JointForImport = { studCount: 4, targetLoadN: 100_000, maxStudLoadN: 200_000 };

describe('check-pass steps of a long file', () => {
  it('take their stud from the method: 1-3-2-4 then the check pass 1-2-3-4, with no guess', () => {
    const r = parseLoggerText(text, undefined, { ...joint, plannedSteps });
    expect(r.run.steps.map((s) => s.position)).toEqual([1, 3, 2, 4, 1, 2, 3, 4]);
    expect(r.warnings.join(' ')).not.toContain('is a guess');
    expect(r.run.steps.at(-1)!.loadsN).toEqual([94_000, 98_000, 96_000, 100_000]);
  });

  it('without the method the check steps keep 8 steps, but each stud is a guess and says so', () => {
    const r = parseLoggerText(text, undefined, joint);
    expect(r.run.steps).toHaveLength(8);
    expect(r.run.steps.slice(0, 4).map((s) => s.position)).toEqual(CROSS);
    expect(r.warnings.filter((w) => w.includes('is a guess'))).toHaveLength(4);
  });

  it('a method whose order the file did not follow is not used (the steps so far differ): a guess again', () => {
    const circular = [1, 2, 3, 4].map((position) => ({ pass: 1, position, check: false }));
    const r = parseLoggerText(text, undefined, { ...joint, plannedSteps: [...circular, ...plannedSteps.slice(4)] });
    expect(r.warnings.filter((w) => w.includes('is a guess'))).toHaveLength(4);
  });
});

describe('planStud', () => {
  const plan = { steps: plannedSteps, riseN: 2000 };
  const atLoad = [94_000, 98_000, 96_000, 100_000];
  const done = CROSS.map((position) => ({ position }));

  it('names the method\'s next check step when the steps so far follow the method', () => {
    expect(planStud(plan, done, atLoad)).toBe(1);
    expect(planStud(plan, [...done, { position: 1 }], atLoad)).toBe(2);
  });

  it('refuses when the snapshot shows that stud not at load (a check finds a tightened nut)', () => {
    expect(planStud(plan, done, [0, 98_000, 96_000, 100_000])).toBeNull();
  });

  it('refuses a step the method does not mark as a check, a step past the method, and no method at all', () => {
    expect(planStud(plan, done.slice(0, 2), atLoad)).toBeNull();
    expect(planStud(plan, [...done, ...done.map(() => ({ position: 1 }))], atLoad)).toBeNull();
    expect(planStud({ riseN: 2000 }, done, atLoad)).toBeNull();
  });
});
