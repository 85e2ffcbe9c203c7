import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { hashToken } from '@/lib/accounts/one-time-token';
import { sequelize } from '@/lib/platform/db';
import { createCohort } from '@/lib/data/cohorts';
import { inviteToCohort, resendInvitation } from '@/lib/data/invitations';
import { count, demoPeople } from './support';

// Issue 17: when the invitation mail cannot be sent the instructor gets the link to hand over, and can resend.
vi.mock('@/lib/mail/mailer', () => ({ sendMail: vi.fn(async () => { throw new Error('relay down (test)'); }) }));

const stamp = Date.now().toString(36);
const address = `resend.${stamp}@test.evenload.test`;
let people: Awaited<ReturnType<typeof demoPeople>>;
let cohortId: number;

const tokenOf = (link: string) => link.match(/\/welcome\/([A-Za-z0-9_-]{43})$/)?.[1] ?? '';

beforeAll(async () => {
  people = await demoPeople();
  cohortId = await createCohort(people.instructor, { name: `Resend ${stamp}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
});

afterAll(async () => {
  await sequelize.query('DELETE FROM one_time_tokens WHERE user_id IN (SELECT id FROM users WHERE email = ?)', { replacements: [address] });
  await sequelize.query('DELETE FROM cohort_members WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM users WHERE email = ?', { replacements: [address] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await sequelize.close();
});

describe('invitation links when mail fails', () => {
  it('hands the stored link over, and a resend gives a fresh stored link to the cohort’s instructor only', async () => {
    const outcome = await inviteToCohort(people.instructor, cohortId, address);
    expect(outcome.notSent).toEqual([address]);
    expect(outcome.handOver).toHaveLength(1);
    const first = tokenOf(outcome.handOver[0]!.link);
    expect(await count('SELECT COUNT(*) AS n FROM one_time_tokens WHERE token_sha256 = ? AND purpose = ?', [hashToken(first), 'invite'])).toBe(1);

    const [account] = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [address] });
    const userId = Number(account!.id);
    await expect(resendInvitation(people.otherInstructor, userId, cohortId)).rejects.toMatchObject({ code: 'not_found' });
    await expect(resendInvitation(people.trainee, userId, cohortId)).rejects.toMatchObject({ code: 'forbidden' });

    const again = await resendInvitation(people.instructor, userId, cohortId);
    const second = tokenOf(again.handOver[0]!.link);
    expect(second).not.toBe(first);
    expect(await count('SELECT COUNT(*) AS n FROM one_time_tokens WHERE token_sha256 = ?', [hashToken(second)])).toBe(1);
    // The People page resends without a cohort: the admin reaches the same person through their latest cohort.
    const fromPeople = await resendInvitation(people.admin, userId, null);
    expect(fromPeople.handOver).toHaveLength(1);
    expect(await count('SELECT COUNT(*) AS n FROM one_time_tokens WHERE user_id = ? AND purpose = ?', [userId, 'invite'])).toBe(3);
  });

  it('refuses a resend to someone who has already set a password', async () => {
    const [member] = await sequelize.query<{ id: number }>('SELECT id FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [address] });
    await sequelize.query("UPDATE users SET password_hash = 'x' WHERE id = ?", { replacements: [member!.id] });
    await expect(resendInvitation(people.instructor, Number(member!.id), cohortId)).rejects.toMatchObject({ code: 'conflict' });
  });
});
