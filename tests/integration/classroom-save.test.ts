import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { classroomCohorts, classroomRealRuns, saveSceneRuns } from '@/lib/data/classroom';
import { storeRun } from '@/lib/data/runs/store-run';
import type { SessionUser } from '@/lib/auth/session';
import { RUNS_PER_SIDE } from '@/lib/classroom/scenes';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';

/**
 * The classroom's save action (app/(lab)/classroom/actions.ts) with the signed-in person supplied
 * here, against the demo database the test command seeds.
 */
const signedIn = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock('@/lib/auth/session', async (importOriginal) => ({ ...(await importOriginal<typeof import('@/lib/auth/session')>()), getSessionUser: async () => signedIn.user }));
vi.mock('next/cache', () => ({ revalidatePath: vi.fn() }));
const { saveSceneAction } = await import('@/app/(lab)/classroom/actions');
const saveAs = (user: SessionUser, data: FormData) => {
  signedIn.user = user;
  return saveSceneAction(IDLE_FORM_STATE, data);
};
let firstNewRun = 0;
const NOTE = 'Classroom scene "One pass or several"%';
let marta: SessionUser;
let kwame: SessionUser;
let martaCohort = 0;
let kwameCohort = 0;
let jointId = 0;
const marker = new Date('2031-05-05T10:00:00Z');

const userByEmail = async (email: string): Promise<SessionUser> => {
  const [row] = await sequelize.query<{ id: number; name: string; role: SessionUser['role'] }>('SELECT id, name, role FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [email] });
  return { id: Number(row!.id), name: row!.name, email, role: row!.role, units: 'si' };
};
const countRuns = async () => {
  const [row] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM runs', { type: QueryTypes.SELECT });
  return Number(row!.n);
};
const form = (values: Record<string, string | number>) => {
  const data = new FormData();
  for (const [k, v] of Object.entries(values)) data.set(k, String(v));
  return data;
};

beforeAll(async () => {
  marta = await userByEmail('marta.ilvesaar@demo.evenload.test');
  kwame = await userByEmail('kwame.duchesne@demo.evenload.test');
  const cohortOf = async (user: SessionUser) => {
    const [row] = await sequelize.query<{ id: number }>('SELECT id FROM cohorts WHERE instructor_id = ? ORDER BY id LIMIT 1', { type: QueryTypes.SELECT, replacements: [user.id] });
    return Number(row!.id);
  };
  martaCohort = await cohortOf(marta);
  kwameCohort = await cohortOf(kwame);
  const [joint] = await sequelize.query<{ id: number }>('SELECT id FROM joints WHERE stud_count = 8 ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  jointId = Number(joint!.id);
  const [last] = await sequelize.query<{ id: number | null }>('SELECT MAX(id) AS id FROM runs', { type: QueryTypes.SELECT });
  firstNewRun = Number(last!.id ?? 0) + 1;
});

afterAll(async () => {
  await sequelize.query('DELETE FROM runs WHERE (recorded_at = ? OR id >= ?) AND notes LIKE ?', { replacements: [marker, firstNewRun, NOTE] });
  await sequelize.close();
});

describe('saving a classroom scene to a cohort', () => {
  it('refuses a trainee with forbidden and writes no run', async () => {
    const before = await countRuns();
    const trainee = await userByEmail('aino.varga@demo.evenload.test');
    const state = await saveAs(trainee, form({ scene: 'passes', jointId, cohortId: martaCohort, seed: 1 }));
    expect(state.status).toBe('error');
    expect(state.code).toBe('forbidden');
    expect(await countRuns()).toBe(before);
  });

  it("refuses another instructor's cohort as not found and writes no run", async () => {
    const before = await countRuns();
    const state = await saveAs(marta, form({ scene: 'passes', jointId, cohortId: kwameCohort, seed: 1 }));
    expect(state.code).toBe('not_found');
    expect(state.fieldErrors?.cohortId?.[0]).toMatch(/not yours/);
    expect(await countRuns()).toBe(before);
  });

  it('names the bad field when the form is incomplete', async () => {
    const state = await saveAs(marta, form({ scene: 'real', jointId, cohortId: martaCohort, seed: 1 }));
    expect(state).toMatchObject({ status: 'error', code: 'invalid_input', message: 'The runs were not saved: check the fields marked.' });
    expect(state.fieldErrors?.scene?.length).toBeGreaterThan(0);
  });

  it('leaves nothing half-saved when a store fails part-way through', async () => {
    const before = await countRuns();
    let calls = 0;
    const failing: typeof storeRun = async (header, run, transaction) => {
      calls += 1;
      if (calls === 5) throw new Error('disk full (simulated)');
      return storeRun(header, run, transaction);
    };
    // The transaction lives in saveSceneRuns (the action only adds the session, zod and the message).
    await expect(saveSceneRuns(marta, { scene: 'passes', jointId, cohortId: martaCohort, seed: 1 }, { storeRun: failing, now: marker })).rejects.toThrow('disk full');
    expect(calls).toBe(5);
    expect(await countRuns()).toBe(before);
  });

  it("stores every side's runs as simulated runs by the instructor in their cohort, with library rows and a compare link", async () => {
    const before = await countRuns();
    const dayBefore = new Date().toISOString().slice(0, 10);
    const state = await saveAs(marta, form({ scene: 'passes', jointId, cohortId: martaCohort, seed: 1 }));
    const dayAfter = new Date().toISOString().slice(0, 10);
    expect(state.status).toBe('ok');
    expect(state.message).toBe(`Saved ${2 * RUNS_PER_SIDE} simulated runs to the cohort.`);
    expect(state.data?.savedCount).toBe(2 * RUNS_PER_SIDE);
    expect(await countRuns()).toBe(before + 2 * RUNS_PER_SIDE);
    const rows = await sequelize.query<{ source: string; operator_id: number; cohort_id: number; method_id: number; steps: number }>(
      'SELECT r.source, r.operator_id, r.cohort_id, r.method_id, (SELECT COUNT(*) FROM tightening_steps s WHERE s.run_id = r.id) AS steps FROM runs r WHERE r.id >= ? AND r.notes LIKE ?',
      { type: QueryTypes.SELECT, replacements: [firstNewRun, NOTE] },
    );
    expect(rows).toHaveLength(2 * RUNS_PER_SIDE);
    for (const row of rows) {
      expect(row.source).toBe('simulated');
      expect(Number(row.operator_id)).toBe(marta.id);
      expect(Number(row.cohort_id)).toBe(martaCohort);
    }
    const methods = [...new Set(rows.map((r) => Number(r.method_id)))];
    expect(methods).toHaveLength(2);
    // One cross pass = 8 steps; 30/60/100 % + check = 32 steps on 8 studs.
    expect([...new Set(rows.map((r) => Number(r.steps)))].sort((a, b) => a - b)).toEqual([8, 32]);
    // The runs are recorded now, so the link covers today (the day read before or after the save).
    const href = state.data?.compareHref ?? '';
    expect([dayBefore, dayAfter].some((day) => new RegExp(`^/compare\\?by=method&ids=\\d+,\\d+&jointId=${jointId}&from=${day}&to=${day}$`).test(href))).toBe(true);
    for (const id of methods) expect(href).toContain(String(id));
  });

  it('offers only measured runs for the "real run" scene, the just-saved simulated runs never among them', async () => {
    // Runs after the save above: the cohort holds simulated runs dated now, the latest of all.
    const { runs, defaultRunId } = await classroomRealRuns(marta, await classroomCohorts(marta));
    expect(runs.length).toBeGreaterThan(0);
    const sources = await sequelize.query<{ source: string }>('SELECT DISTINCT source FROM runs WHERE id IN (?)', { type: QueryTypes.SELECT, replacements: [runs.map((r) => r.id)] });
    expect(sources.map((r) => r.source)).not.toContain('simulated');
    expect(runs.every((r) => r.source !== 'simulated' && !/simulated/i.test(r.label))).toBe(true);
    expect(runs.map((r) => r.id)).toContain(defaultRunId);
  });
});
