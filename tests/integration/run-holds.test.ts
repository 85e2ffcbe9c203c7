import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { loadRunHolds, saveRunHolds } from '@/lib/data/run-holds';
import type { SessionUser } from '@/lib/auth/session';
import type { Role } from '@/models/user';
import { DEMO_ACCOUNTS } from '../support/http-session';

// addHoldsAction (app/(lab)/runs/[id]/actions.ts) reads the file or typed text and calls saveRunHolds.
let runId: number;
let studCount: number;
const users = {} as Record<Role, SessionUser>;

const holdRows = async () =>
  Number((await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM run_holds WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] }))[0]!.n);
const csv = (rows: string[]) => [`elapsed,${Array.from({ length: studCount }, (_, i) => i + 1).join(',')}`, ...rows].join('\n');
const row = (time: string, kN: number) => `${time},${Array.from({ length: studCount }, () => kN).join(',')}`;

beforeAll(async () => {
  for (const role of ['admin', 'instructor', 'researcher', 'trainee'] as const) {
    const [u] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS[role]] });
    users[role] = { id: u!.id, name: u!.name, email: DEMO_ACCOUNTS[role], role, units: 'si' };
  }
  const [run] = await sequelize.query<{ id: number; stud_count: number }>(
    `SELECT r.id, r.stud_count FROM runs r JOIN cohorts c ON c.id = r.cohort_id WHERE c.instructor_id = ? AND r.source <> 'simulated'
       AND EXISTS (SELECT 1 FROM tightening_steps s WHERE s.run_id = r.id) ORDER BY r.id LIMIT 1`,
    { type: QueryTypes.SELECT, replacements: [users.instructor.id] },
  );
  runId = run!.id;
  studCount = run!.stud_count;
});

afterAll(async () => {
  await sequelize.query('DELETE FROM run_holds WHERE run_id = ?', { replacements: [runId] });
  await sequelize.close();
});

describe('saveRunHolds (behind addHoldsAction)', () => {
  it('stores a hold after the last pass and reads it back per time', async () => {
    const saved = await saveRunHolds(users.instructor, runId, csv([row('0', 80), row('10 min', 79), row('1 h', 78.5)]), 'si');
    expect(saved.points).toBe(3);
    expect(await holdRows()).toBe(3 * studCount);
    const points = await loadRunHolds(runId, studCount);
    expect(points.map((p) => p.elapsedS)).toEqual([0, 600, 3600]);
    expect(points[2]!.loadsN.every((n) => n === 78_500)).toBe(true);
  });

  it('replaces the hold after the same pass', async () => {
    await saveRunHolds(users.researcher, runId, csv([row('0', 80), row('4 h', 77)]), 'si');
    expect((await loadRunHolds(runId, studCount)).map((p) => p.elapsedS)).toEqual([0, 14_400]);
  });

  it('refuses a trainee, and a bad file changes nothing', async () => {
    const before = await holdRows();
    await expect(saveRunHolds(users.trainee, runId, csv([row('0', 80)]), 'si')).rejects.toMatchObject({ code: 'forbidden' });
    await expect(saveRunHolds(users.instructor, runId, csv([row('0', 80), `5,${'x,'.repeat(studCount - 1)}x`]), 'si')).rejects.toMatchObject({ code: 'invalid_input' });
    expect(await holdRows()).toBe(before);
  });
});
