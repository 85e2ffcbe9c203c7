import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { handleJointSave, handleLubricantSave, handleMethodSave } from '@/lib/data/library-forms';
import type { SessionUser } from '@/lib/auth/session';

/**
 * The work of the server actions in app/(lab)/joints/actions.ts (they add only the session,
 * revalidatePath and redirect): trainees and researchers are refused, bad input writes nothing.
 */
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
      for (const state of [
        await handleJointSave(user(role), null, jointFormData()),
        await handleMethodSave(user(role), null, methodFormData()),
        await handleLubricantSave(user(role), null, lubricantFormData()),
      ]) {
        expect(state.status).toBe('error');
        expect(state.code).toBe('forbidden');
        expect(state.message).toBe('Your role does not allow this.');
      }
      expect(await rows()).toEqual(before);
    });
  }

  it('refuses a signed-out caller with unauthenticated', async () => {
    const state = await handleJointSave(null, null, jointFormData());
    expect(state.code).toBe('unauthenticated');
  });

  it('returns per-field messages for bad input and changes no rows', async () => {
    const before = await rows();
    const state = await handleJointSave(user('instructor'), null, jointFormData({ studCount: 'eight', gasketType: '' }));
    expect(state.status).toBe('error');
    expect(state.code).toBe('invalid_input');
    expect(state.errors.studCount?.[0]).toMatch(/whole number/);
    expect(state.errors.gasketType?.[0]).toBe('Enter the gasket type.');
    const lube = await handleLubricantSave(user('admin'), null, (() => { const d = lubricantFormData(); d.set('nominalNutFactor', '0.9'); return d; })());
    expect(lube.errors.nominalNutFactor?.[0]).toMatch(/between 0.05 and 0.60/);
    expect(await rows()).toEqual(before);
  });

  it('saves a joint and its 8 positions for an instructor', async () => {
    const before = await rows();
    const state = await handleJointSave(user('instructor'), null, jointFormData());
    expect(state.status).toBe('saved');
    const after = await rows();
    expect(after.j - before.j).toBe(1);
    expect(after.p - before.p).toBe(8);
  });
});
