import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { addRunComment } from '@/lib/data/run-comments';
import type { SessionUser } from '@/lib/auth/session';
import type { Role } from '@/models/user';
import { DEMO_ACCOUNTS } from '../support/http-session';

// addCommentAction (app/(lab)/runs/[id]/actions.ts) validates the body and calls addRunComment:
// these tests drive addRunComment as each role.
let runId: number;
const users = {} as Record<Role, SessionUser>;

const commentCount = async () =>
  Number((await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM run_comments WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] }))[0]!.n);

beforeAll(async () => {
  for (const role of ['admin', 'instructor', 'researcher', 'trainee'] as const) {
    const [row] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS[role]] });
    users[role] = { id: row!.id, name: row!.name, email: DEMO_ACCOUNTS[role], role, units: 'si' };
  }
  const [run] = await sequelize.query<{ id: number }>(
    `SELECT r.id FROM runs r JOIN cohorts c ON c.id = r.cohort_id WHERE c.instructor_id = ? AND r.operator_id <> ? ORDER BY r.id LIMIT 1`,
    { type: QueryTypes.SELECT, replacements: [users.instructor.id, users.trainee.id] },
  );
  runId = run!.id;
});

afterAll(async () => {
  await sequelize.query("DELETE FROM run_comments WHERE body LIKE 'test comment%'");
  await sequelize.close();
});

describe('addRunComment (behind addCommentAction)', () => {
  it("lets the cohort's instructor comment", async () => {
    const before = await commentCount();
    await addRunComment(users.instructor, runId, 'test comment: keep the wrench square to the nut');
    expect(await commentCount()).toBe(before + 1);
  });

  it.each(['trainee', 'researcher'] as const)('refuses a %s and writes nothing', async (role) => {
    const before = await commentCount();
    await expect(addRunComment(users[role], runId, 'test comment from the wrong role')).rejects.toMatchObject({ code: 'forbidden' });
    expect(await commentCount()).toBe(before);
  });

  it('refuses a signed-out caller', async () => {
    await expect(addRunComment(null, runId, 'test comment signed out')).rejects.toMatchObject({ code: 'unauthenticated' });
  });

  it('answers not found for a run the instructor does not teach', async () => {
    const [other] = await sequelize.query<{ id: number }>(
      'SELECT r.id FROM runs r JOIN cohorts c ON c.id = r.cohort_id WHERE c.instructor_id <> ? AND r.operator_id <> ? ORDER BY r.id LIMIT 1',
      { type: QueryTypes.SELECT, replacements: [users.instructor.id, users.instructor.id] },
    );
    await expect(addRunComment(users.instructor, other!.id, 'test comment elsewhere')).rejects.toMatchObject({ code: 'not_found' });
  });
});
