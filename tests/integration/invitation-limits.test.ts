import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { createCohort } from '@/lib/data/cohorts';
import { INVITATION_LIMITS, inviteToCohort } from '@/lib/data/invitations';
import type { SessionUser } from '@/lib/auth/session';
import { count, sessionUserFor, tableCounts } from './support';

// Issue 13 (low): 20 re-invites gave 20 tokens. The limits are counted in MariaDB (one_time_tokens).
const stamp = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
const address = (label: string) => `lim-${label}.${stamp}@test.evenload.test`;
let instructor: SessionUser;
let cohortId: number;

beforeAll(async () => {
  // An instructor of this test's own, so counts from other tests (or earlier runs) do not mix in.
  const email = address('instructor');
  await sequelize.query("INSERT INTO users (name, email, password_hash, role, is_active, created_at, updated_at) VALUES ('Limit Tester', ?, NULL, 'instructor', 1, NOW(), NOW())", { replacements: [email] });
  instructor = await sessionUserFor(email);
  cohortId = await createCohort(instructor, { name: `Limits ${stamp}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
});

afterAll(async () => {
  await sequelize.query('DELETE FROM one_time_tokens WHERE created_by_id = ?', { replacements: [instructor.id] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await sequelize.query("DELETE FROM users WHERE email LIKE ?", { replacements: [`lim-%.${stamp}@test.evenload.test`] });
  await sequelize.close();
});

describe('invitation limits', () => {
  it(`gives one address at most ${INVITATION_LIMITS.perAddressPerDay} invitation links a day, then a clear message and no new token`, async () => {
    const email = address('again');
    for (let i = 0; i < INVITATION_LIMITS.perAddressPerDay; i += 1) expect((await inviteToCohort(instructor, cohortId, email)).invited).toEqual([email]);
    const before = await tableCounts();
    await expect(inviteToCohort(instructor, cohortId, email)).rejects.toMatchObject({
      code: 'rate_limited',
      message: expect.stringContaining(`${email} has already been sent ${INVITATION_LIMITS.perAddressPerDay} invitations today`),
    });
    expect(await tableCounts()).toEqual(before);
  });

  it(`lets one instructor send at most ${INVITATION_LIMITS.perInstructorPerHour} invitation links an hour, all or nothing per list`, async () => {
    const sent = await count('SELECT COUNT(*) AS n FROM one_time_tokens WHERE created_by_id = ?', [instructor.id]);
    const room = INVITATION_LIMITS.perInstructorPerHour - sent;
    const fill = Array.from({ length: room }, (_, i) => address(`fill${i}`));
    expect((await inviteToCohort(instructor, cohortId, fill.join('\n'))).invited).toHaveLength(room);
    const before = await tableCounts();
    // Simultaneous lists (as from two app instances) are all refused, and no token is added.
    const results = await Promise.allSettled([address('over1'), address('over2'), `${address('over3')}\n${address('over4')}`].map((list) => inviteToCohort(instructor, cohortId, list)));
    for (const result of results) {
      expect(result.status).toBe('rejected');
      expect((result as PromiseRejectedResult).reason).toMatchObject({ code: 'rate_limited', message: expect.stringContaining(`You have sent ${INVITATION_LIMITS.perInstructorPerHour} invitations in the last hour`) });
    }
    expect(await tableCounts()).toEqual(before);
    expect(await count('SELECT COUNT(*) AS n FROM one_time_tokens WHERE created_by_id = ?', [instructor.id])).toBe(INVITATION_LIMITS.perInstructorPerHour);
  });
});
