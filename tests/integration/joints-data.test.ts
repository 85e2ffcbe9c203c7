import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { getJoint, listJointLibrary, saveJoint, saveLubricant, saveMethod } from '@/lib/data/joints';
import { lbfToN } from '@/lib/calc/units';
import type { JointInput } from '@/lib/joints/joint-input';
import { NO_GASKET_DATA } from '@/lib/joints/gasket-input';
import type { SessionUser } from '@/lib/auth/session';

const TAG = `itest-joints-${Date.now()}`;
const instructor: SessionUser = { id: 1, name: 'Test instructor', email: 'test@demo.evenload.test', role: 'instructor', units: 'si' };
const trainee: SessionUser = { ...instructor, role: 'trainee' };

afterAll(async () => {
  await sequelize.query('DELETE FROM joints WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM methods WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM lubricants WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});

const count = async (sql: string, replacements: unknown[] = []) =>
  Number((await sequelize.query<{ n: number }>(sql, { type: QueryTypes.SELECT, replacements }))[0]!.n);

const joint = (overrides: Partial<JointInput> = {}): JointInput => ({
  name: `${TAG} joint`, nominalSize: 'NPS 4', pressureClass: 'Class 150', studCount: 8,
  thread: { system: 'inch', diameterIn: 0.625, threadsPerInch: 11 }, studGrade: 'A193-B7', nutGrade: 'ASTM A194 2H',
  washer: null, gasketType: 'spiral-wound', bandPercent: 10, targetLoadN: lbfToN(11_865), notes: null,
  positions: Array.from({ length: 8 }, (_, i) => ({ position: i + 1, calibrationFactor: 1 + i / 100, note: i === 0 ? 'top' : null })),
  gasket: NO_GASKET_DATA,
  ...overrides,
});

describe('lib/data/joints against MariaDB', () => {
  it('stores a joint with all its positions and reads them back in order', async () => {
    const { id } = await saveJoint(instructor, null, joint());
    const read = await getJoint(instructor, id);
    expect(read?.studCount).toBe(8);
    expect(read?.gradeId).toBe('A193-B7');
    expect(read?.positions.map((p) => p.position)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(read?.positions[7]?.calibrationFactor).toBeCloseTo(1.07, 12);
    expect(read?.positions[0]?.note).toBe('top');
    expect(read?.runCount).toBe(0);
  });

  it('stores the gasket and flange data and reads it back', async () => {
    const gasket = { innerMm: 100, outerMm: 150, areaMm2: null, minSeatingMpa: 69, maxMpa: 207, stressSource: 'maker data sheet', flangeFacing: 'Raised face', clampLengthMm: 76.2 };
    const { id } = await saveJoint(instructor, null, joint({ name: `${TAG} gasket`, gasket }));
    expect((await getJoint(instructor, id))?.gasket).toEqual(gasket);
  });

  it('changes the stud count of a joint without runs and replaces its positions', async () => {
    const { id } = await saveJoint(instructor, null, joint({ name: `${TAG} resize` }));
    const twelve = Array.from({ length: 12 }, (_, i) => ({ position: i + 1, calibrationFactor: 1, note: null }));
    await saveJoint(instructor, id, joint({ name: `${TAG} resize`, studCount: 12, positions: twelve }), 0);
    expect(await count('SELECT COUNT(*) AS n FROM joint_positions WHERE joint_id = ?', [id])).toBe(12);
  });

  it('refuses to change the stud count of a joint with runs, and changes nothing', async () => {
    const [row] = await sequelize.query<{ id: number; stud_count: number; target_load_n: number }>(
      'SELECT j.id, j.stud_count, j.target_load_n FROM joints j WHERE EXISTS (SELECT 1 FROM runs r WHERE r.joint_id = j.id) LIMIT 1',
      { type: QueryTypes.SELECT },
    );
    expect(row, 'the demo seed has joints with runs').toBeDefined();
    const before = await getJoint(instructor, row!.id);
    const n = row!.stud_count + 4;
    const attempt = joint({ name: before!.name, studCount: n, positions: Array.from({ length: n }, (_, i) => ({ position: i + 1, calibrationFactor: 1, note: null })) });
    await expect(saveJoint(instructor, row!.id, attempt, before!.version)).rejects.toMatchObject({ code: 'conflict', details: { field: 'studCount' } });
    const after = await getJoint(instructor, row!.id);
    expect(after).toEqual(before);
  });

  it('refuses every write to a trainee with forbidden', async () => {
    await expect(saveJoint(trainee, null, joint({ name: `${TAG} by trainee` }))).rejects.toMatchObject({ code: 'forbidden' });
    await expect(listJointLibrary(trainee)).rejects.toMatchObject({ code: 'forbidden' });
    expect(await count('SELECT COUNT(*) AS n FROM joints WHERE name = ?', [`${TAG} by trainee`])).toBe(0);
  });

  it('rolls the joint back when its positions cannot be stored (one transaction)', async () => {
    const tooLong = joint({ name: `${TAG} half`, positions: joint().positions.map((p, i) => (i === 7 ? { ...p, note: 'x'.repeat(300) } : p)) });
    await expect(saveJoint(instructor, null, tooLong)).rejects.toBeTruthy();
    expect(await count('SELECT COUNT(*) AS n FROM joints WHERE name = ?', [`${TAG} half`])).toBe(0);
  });

  it('stores methods and lubricants, refusing a second one of the same name', async () => {
    const method = { name: `${TAG} method`, toolKind: 'manual_torque_wrench' as const, checkPasses: 1, tensionerCoverage: 'one_stud' as const, notes: null,
      passes: [{ percentOfTarget: 30, pattern: 'cross' as const, orderByStudCount: { '8': [1, 5, 3, 7, 2, 6, 4, 8] } }] };
    const { id } = await saveMethod(instructor, null, method);
    await expect(saveMethod(instructor, null, method)).rejects.toMatchObject({ code: 'conflict', details: { field: 'name' } });
    const library = await listJointLibrary(instructor);
    expect(library.methods.find((m) => m.id === id)?.passes).toEqual(method.passes);
    await saveLubricant(instructor, null, { name: `${TAG} paste`, nominalNutFactor: 0.16, notes: null });
    expect((await listJointLibrary(instructor)).lubricants.some((l) => l.name === `${TAG} paste` && l.nominalNutFactor === 0.16)).toBe(true);
  });
});
