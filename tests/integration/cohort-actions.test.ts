import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { SessionUser } from '@/lib/auth/session';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { sessionUserFor, tableCounts } from './support';

// The real server actions, with the signed-in person supplied here instead of a next-auth cookie.
const signedIn = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock('@/lib/auth/session', async (importOriginal) => ({ ...(await importOriginal<typeof import('@/lib/auth/session')>()), getSessionUser: async () => signedIn.user }));
vi.mock('next/cache', () => ({ revalidatePath: vi.fn() }));

const { inviteAction, saveCriteriaAction, signOffAction, createCohortAction } = await import('@/app/(lab)/cohorts/actions');
const { changeRoleAction, setActiveAction } = await import('@/app/(lab)/people/actions');

let cohortId: number;
let runId: number;
let trainee: SessionUser;
let researcher: SessionUser;
let instructor: SessionUser;
let admin: SessionUser;

const form = (entries: Record<string, string>) => {
  const data = new FormData();
  for (const [key, value] of Object.entries(entries)) data.set(key, value);
  return data;
};
const idle = IDLE_FORM_STATE;

beforeAll(async () => {
  trainee = await sessionUserFor(DEMO_ACCOUNTS.trainee);
  researcher = await sessionUserFor(DEMO_ACCOUNTS.researcher);
  instructor = await sessionUserFor(DEMO_ACCOUNTS.instructor);
  admin = await sessionUserFor(DEMO_ACCOUNTS.admin);
  const [row] = await sequelize.query<{ id: number; run_id: number }>(
    "SELECT c.id, r.id AS run_id FROM cohorts c JOIN runs r ON r.cohort_id = c.id AND r.status = 'complete' WHERE c.instructor_id = ? ORDER BY r.id LIMIT 1",
    { type: QueryTypes.SELECT, replacements: [instructor.id] },
  );
  cohortId = Number(row!.id);
  runId = Number(row!.run_id);
});

beforeEach(() => {
  signedIn.user = null;
});

afterAll(async () => {
  await sequelize.close();
});

describe('cohort server actions refuse the wrong roles and change no row', () => {
  for (const who of ['trainee', 'researcher'] as const) {
    it(`a ${who} cannot invite, set criteria, sign off or create a cohort`, async () => {
      signedIn.user = who === 'trainee' ? trainee : researcher;
      const before = await tableCounts();
      const refusals = [
        await inviteAction(cohortId, idle, form({ addresses: 'someone.new@test.evenload.test' })),
        await saveCriteriaAction(cohortId, idle, form({ bandPercent: '10', maxCvPercent: '5', maxYieldPercent: '70', requirePattern: 'on' })),
        await signOffAction(cohortId, runId, idle, form({ comment: 'not mine to sign' })),
        await createCohortAction(idle, form({ name: 'Not allowed', site: 'Nowhere', startsOn: '2026-12-01', endsOn: '2026-12-02' })),
      ];
      for (const state of refusals) expect(state).toMatchObject({ status: 'error', message: 'Your role does not allow this.' });
      expect(await tableCounts()).toEqual(before);
    });
  }

  it('a signed-out caller is asked to sign in', async () => {
    const before = await tableCounts();
    expect(await inviteAction(cohortId, idle, form({ addresses: 'x@test.evenload.test' }))).toMatchObject({ status: 'error', message: 'Sign in to continue.' });
    expect(await tableCounts()).toEqual(before);
  });

  it('an instructor gets every invalid entry named and nothing saved', async () => {
    signedIn.user = instructor;
    const before = await tableCounts();
    const state = await inviteAction(cohortId, idle, form({ addresses: 'good@test.evenload.test; bad-one; worse@' }));
    expect(state.status).toBe('error');
    expect(state.fieldErrors?.addresses?.[0]).toContain('"bad-one", "worse@"');
    expect(await tableCounts()).toEqual(before);
  });
});

describe('people server actions', () => {
  it('an instructor cannot change roles and an admin cannot change their own', async () => {
    signedIn.user = instructor;
    expect(await changeRoleAction(instructor.id, idle, form({ role: 'admin' }))).toMatchObject({ status: 'error', message: 'Your role does not allow this.' });
    signedIn.user = admin;
    expect(await changeRoleAction(admin.id, idle, form({ role: 'trainee' }))).toMatchObject({ status: 'error', message: expect.stringContaining('cannot change your own role') });
    expect(await setActiveAction(admin.id, false, idle, form({}))).toMatchObject({ status: 'error' });
    const [me] = await sequelize.query<{ role: string; is_active: number }>('SELECT role, is_active FROM users WHERE id = ?', { type: QueryTypes.SELECT, replacements: [admin.id] });
    expect(me).toMatchObject({ role: 'admin', is_active: 1 });
    const [inst] = await sequelize.query<{ role: string }>('SELECT role FROM users WHERE id = ?', { type: QueryTypes.SELECT, replacements: [instructor.id] });
    expect(inst!.role).toBe('instructor');
  });
});
