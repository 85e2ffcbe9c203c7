import { describe, expect, it } from 'vitest';
import { parseStudList, stepOfPull, type PullContext } from '@/lib/record/manual-pulls';
import { planSteps } from '@/lib/record/step-plan';
import type { MethodPass } from '@/models/method';

// Hand-entry rows of a tensioner step that pulls several studs. Invented loads; the kN → N factor is the SI
// prefix (1 kN = 1000 N). 50 % coverage pulls the odd then the even positions, 100 % every stud (common practice).
const ctx: PullContext = { studCount: 8, unit: 'kN', where: 'Row 1 (pass 1)', row: 1, maxStudLoadN: 200_000, maxStudLoadText: '200 kN (test limit)' };
const loadsN = [80_000, 0, 80_000, 0, 80_000, 0, 80_000, 0];
const applied = (byStud: Record<number, number>) => Array.from({ length: 8 }, (_, i) => byStud[i + 1] ?? null);

describe('hand entry: a row that names several studs', () => {
  it('reads the studs named, separated by spaces, commas or semicolons', () => {
    expect(parseStudList('1 3, 5;7', 8)).toEqual({ ok: true, positions: [1, 3, 5, 7] });
  });

  it('refuses a stud named twice, a stud not on the joint, a token that is not a number, and an empty list', () => {
    expect(parseStudList('1 3 3', 8)).toEqual({ ok: false, problem: 'stud 3 is named twice' });
    expect(parseStudList('1 9', 8)).toEqual({ ok: false, problem: 'stud 9 is not on this joint (studs 1 to 8)' });
    expect(parseStudList('0', 8)).toEqual({ ok: false, problem: 'stud 0 is not on this joint (studs 1 to 8)' });
    expect(parseStudList('1 x', 8)).toMatchObject({ ok: false, problem: expect.stringMatching(/^"x" is not a stud number/) });
    expect(parseStudList('  ', 8).ok).toBe(false);
  });

  it('makes covers as ingest does: applied from the row beneath (kN → N), residual from the row itself', () => {
    const step = stepOfPull({ studs: '1 3 5 7', applied: applied({ 1: 92, 3: 92.5, 5: 92, 7: 91 }) }, loadsN, ctx);
    expect(step.position).toBe(1);
    expect(step.covers).toEqual([
      { position: 1, appliedN: 92_000, residualN: 80_000 },
      { position: 3, appliedN: 92_500, residualN: 80_000 },
      { position: 5, appliedN: 92_000, residualN: 80_000 },
      { position: 7, appliedN: 91_000, residualN: 80_000 },
    ]);
  });

  it('keeps a row of one stud without an applied load a plain one-stud step', () => {
    expect(stepOfPull({ studs: '4', applied: applied({}) }, loadsN, ctx)).toEqual({ position: 4, covers: null });
  });

  it('names the row and stud of a missing or stray applied load, and of a bad stud list', () => {
    const fail = (studs: string, byStud: Record<number, number>) => {
      try {
        stepOfPull({ studs, applied: applied(byStud) }, loadsN, ctx);
      } catch (e) {
        return e as { message: string; details: { row: number; column: string } };
      }
      throw new Error('expected a refusal');
    };
    expect(fail('1 3', { 1: 92 })).toMatchObject({ message: 'Row 1 (pass 1): stud 3: the applied load is missing. Type the load while the tool held the stud.', details: { row: 1, column: 'Applied 3' } });
    expect(fail('1 3', { 1: 92, 3: 92, 5: 92 }).message).toMatch(/stud 5 has an applied load but is not among the studs pulled \(1, 3\)/);
    expect(fail('1 1', { 1: 92 })).toMatchObject({ message: 'Row 1 (pass 1): stud 1 is named twice.', details: { column: 'Studs' } });
    expect(fail('1 3', { 1: 92, 3: 250 }).message).toMatch(/applied load 250 kN is above the limit of 200 kN \(test limit\)/);
  });
});

describe('the grid plan of a method whose tool set pulls several studs', () => {
  const pass: MethodPass = { percentOfTarget: 100, pattern: 'cross', orderByStudCount: { '8': [1, 5, 3, 7, 2, 6, 4, 8], '5': [1, 2, 3, 4, 5] } };
  const method = (tensionerCoverage: 'every_stud' | 'every_second_stud' | 'one_stud') => ({ name: 'T', passes: [pass, pass], checkPasses: 1, tensionerCoverage });

  it('has one row per group: 100 % one per pass, 50 % two (odd, even), check passes included', () => {
    expect(planSteps(method('every_stud'), 8).steps.map((s) => [s.pass, s.positions.join(' ')])).toEqual([[1, '1 2 3 4 5 6 7 8'], [2, '1 2 3 4 5 6 7 8'], [3, '1 2 3 4 5 6 7 8']]);
    expect(planSteps(method('every_second_stud'), 8).steps.map((s) => s.positions.join(' '))).toEqual(['1 3 5 7', '2 4 6 8', '1 3 5 7', '2 4 6 8', '1 3 5 7', '2 4 6 8']);
    expect(planSteps(method('one_stud'), 8).steps).toHaveLength(24);
  });

  it('says why 50 % coverage has no plan on an odd stud count', () => {
    expect(planSteps(method('every_second_stud'), 5).problem).toMatch(/every second stud, which needs an even number of studs; this joint has 5/);
  });
});
