import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { handleSaveScene } from '@/lib/data/classroom-save-scene';
import { storeRun } from '@/lib/data/runs/store-run';
import type { SessionUser } from '@/lib/auth/session';
import { RUNS_PER_SIDE } from '@/lib/classroom/scenes';

/**
 * The work of the classroom's save action (app/(lab)/classroom/actions.ts adds only the session
 * and revalidatePath), against the demo database the test command seeds.
 */
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
});

afterAll(async () => {
  await sequelize.query('DELETE FROM runs WHERE recorded_at = ? AND notes LIKE ?', { replacements: [marker, NOTE] });
  await sequelize.close();
});

describe('saving a classroom scene to a cohort', () => {
  it('refuses a trainee with forbidden and writes no run', async () => {
    const before = await countRuns();
    const trainee = await userByEmail('aino.varga@demo.evenload.test');
    const state = await handleSaveScene(trainee, form({ scene: 'passes', jointId, cohortId: martaCohort, seed: 1 }));
    expect(state.status).toBe('error');
    expect(state.code).toBe('forbidden');
    expect(await countRuns()).toBe(before);
  });

  it("refuses another instructor's cohort as not found and writes no run", async () => {
    const before = await countRuns();
    const state = await handleSaveScene(marta, form({ scene: 'passes', jointId, cohortId: kwameCohort, seed: 1 }));
    expect(state.code).toBe('not_found');
    expect(state.errors.cohortId?.[0]).toMatch(/not yours/);
    expect(await countRuns()).toBe(before);
  });

  it('names the bad field when the form is incomplete', async () => {
    const state = await handleSaveScene(marta, form({ scene: 'real', jointId, cohortId: martaCohort, seed: 1 }));
    expect(state.code).toBe('invalid_input');
    expect(state.errors.scene?.length).toBeGreaterThan(0);
  });

  it('leaves nothing half-saved when a store fails part-way through', async () => {
    const before = await countRuns();
    let calls = 0;
    const failing: typeof storeRun = async (header, run, transaction) => {
      calls += 1;
      if (calls === 5) throw new Error('disk full (simulated)');
      return storeRun(header, run, transaction);
    };
    await expect(handleSaveScene(marta, form({ scene: 'passes', jointId, cohortId: martaCohort, seed: 1 }), { storeRun: failing, now: marker })).rejects.toThrow('disk full');
    expect(calls).toBe(5);
    expect(await countRuns()).toBe(before);
  });

  it("stores every side's runs as simulated runs by the instructor in their cohort, with library rows and a compare link", async () => {
    const before = await countRuns();
    const state = await handleSaveScene(marta, form({ scene: 'passes', jointId, cohortId: martaCohort, seed: 1 }), { now: marker });
    expect(state.status).toBe('saved');
    expect(state.savedCount).toBe(2 * RUNS_PER_SIDE);
    expect(await countRuns()).toBe(before + 2 * RUNS_PER_SIDE);
    const rows = await sequelize.query<{ source: string; operator_id: number; cohort_id: number; method_id: number; steps: number }>(
      'SELECT r.source, r.operator_id, r.cohort_id, r.method_id, (SELECT COUNT(*) FROM tightening_steps s WHERE s.run_id = r.id) AS steps FROM runs r WHERE r.recorded_at = ? AND r.notes LIKE ?',
      { type: QueryTypes.SELECT, replacements: [marker, NOTE] },
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
    expect(state.compareHref).toMatch(new RegExp(`^/compare\\?by=method&ids=\\d+,\\d+&jointId=${jointId}&from=2031-05-05&to=2031-05-05$`));
    for (const id of methods) expect(state.compareHref).toContain(String(id));
  });
});
