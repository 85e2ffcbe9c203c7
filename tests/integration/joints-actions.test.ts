import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { SessionUser } from '@/lib/auth/session';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { actionOutcome } from './support';

/**
 * The server actions in app/(lab)/joints/actions.ts, with the signed-in person supplied here:
 * trainees and researchers are refused, bad input writes nothing, a save goes back to the list.
 */
const signedIn = vi.hoisted(() => ({ user: null as SessionUser | null }));
vi.mock('@/lib/auth/session', async (importOriginal) => ({ ...(await importOriginal<typeof import('@/lib/auth/session')>()), getSessionUser: async () => signedIn.user }));
vi.mock('next/cache', () => ({ revalidatePath: vi.fn() }));
const { saveJointAction, saveLubricantAction, saveMethodAction } = await import('@/app/(lab)/joints/actions');

const as = (who: SessionUser | null) => {
  signedIn.user = who;
  return {
    joint: (data: FormData) => actionOutcome(saveJointAction(null, IDLE_FORM_STATE, data)),
    method: (data: FormData) => actionOutcome(saveMethodAction(null, IDLE_FORM_STATE, data)),
    lubricant: (data: FormData) => actionOutcome(saveLubricantAction(null, IDLE_FORM_STATE, data)),
  };
};
const TAG = `itest-actions-${Date.now()}`;
const user = (role: SessionUser['role']): SessionUser => ({ id: 1, name: role, email: `${role}@demo.evenload.test`, role, units: 'si' });

afterAll(async () => {
  await sequelize.query('DELETE FROM joints WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM methods WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM lubricants WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});

const rows = async () => {
  const [r] = await sequelize.query<{ j: number; p: number; m: number; l: number }>(
    'SELECT (SELECT COUNT(*) FROM joints) AS j, (SELECT COUNT(*) FROM joint_positions) AS p, (SELECT COUNT(*) FROM methods) AS m, (SELECT COUNT(*) FROM lubricants) AS l',
    { type: QueryTypes.SELECT },
  );
  return { j: Number(r!.j), p: Number(r!.p), m: Number(r!.m), l: Number(r!.l) };
};

function jointFormData(overrides: Record<string, string> = {}): FormData {
  const values: Record<string, string> = {
    name: `${TAG} joint`, nominalSize: 'NPS 4', pressureClass: 'Class 150', studCount: '8', threadChoice: '5/8-11', studGrade: 'A193-B7',
    nutGrade: '', washer: '', gasketType: 'spiral-wound', bandPercent: '10', notes: '', targetMode: 'percentOfYield', targetPercent: '50', units: 'si',
    ...overrides,
  };
  const data = new FormData();
  for (const [k, v] of Object.entries(values)) data.set(k, v);
  return data;
}

const methodFormData = () => {
  const data = new FormData();
  for (const [k, v] of Object.entries({ name: `${TAG} method`, toolKind: 'other', checkPasses: '0', notes: '', passCount: '1', studCounts: '8', 'pass-0-percent': '100', 'pass-0-order-8': '1 2 3 4 5 6 7 8' })) data.set(k, v);
  return data;
};
const lubricantFormData = () => {
  const data = new FormData();
  data.set('name', `${TAG} paste`);
  data.set('nominalNutFactor', '0.15');
  return data;
};

describe('joint-library server actions', () => {
  for (const role of ['trainee', 'researcher'] as const) {
    it(`refuses a ${role} with forbidden (403) on every form and writes no row`, async () => {
      const before = await rows();
      const caller = as(user(role));
      for (const state of [await caller.joint(jointFormData()), await caller.method(methodFormData()), await caller.lubricant(lubricantFormData())]) {
        expect(state).toMatchObject({ status: 'error', code: 'forbidden', message: 'Your role does not allow this.' });
      }
      expect(await rows()).toEqual(before);
    });
  }

  it('refuses a signed-out caller with unauthenticated', async () => {
    expect(await as(null).joint(jointFormData())).toMatchObject({ status: 'error', code: 'unauthenticated' });
  });

  it('returns per-field messages for bad input and changes no rows', async () => {
    const before = await rows();
    const state = await as(user('instructor')).joint(jointFormData({ studCount: 'eight', gasketType: '' }));
    expect(state).toMatchObject({ status: 'error', code: 'invalid_input' });
    const errors = 'fieldErrors' in state ? state.fieldErrors : undefined;
    expect(errors?.studCount?.[0]).toMatch(/whole number/);
    expect(errors?.gasketType?.[0]).toBe('Enter the gasket type.');
    const lube = await as(user('admin')).lubricant((() => { const d = lubricantFormData(); d.set('nominalNutFactor', '0.9'); return d; })());
    expect('fieldErrors' in lube ? lube.fieldErrors?.nominalNutFactor?.[0] : undefined).toMatch(/between 0.05 and 0.60/);
    expect(await rows()).toEqual(before);
  });

  it('saves a joint and its 8 positions for an instructor', async () => {
    const before = await rows();
    expect(await as(user('instructor')).joint(jointFormData())).toEqual({ redirectedTo: '/joints?saved=joint#joints' });
    const after = await rows();
    expect(after.j - before.j).toBe(1);
    expect(after.p - before.p).toBe(8);
  });
});
