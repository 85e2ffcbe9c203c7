import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { getJoint, saveJoint } from '@/lib/data/joints';
import { storeRun } from '@/lib/data/runs/store-run';
import { refreshGasketFigures } from '@/lib/data/runs/gasket-figures';
import { NO_GASKET_DATA } from '@/lib/joints/gasket-input';
import { fourStudJoint } from './calibration-fixture';
import type { SessionUser } from '@/lib/auth/session';

const TAG = `itest-gasket-${Date.now()}`;
// User 1 of the demo seed is the admin.
const admin: SessionUser = { id: 1, name: 'Test admin', email: 'test@demo.evenload.test', role: 'admin', units: 'si' };

afterAll(async () => {
  await sequelize.query('DELETE r FROM runs r JOIN joints j ON j.id = r.joint_id WHERE j.name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM joints WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});

const LOADS = [50_000, 49_000, 51_000, 50_000];
const store = (jointId: number) =>
  sequelize.transaction((t) =>
    storeRun({ jointId, methodId: 1, lubricantId: 1, operatorId: admin.id, cohortId: null, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date() },
      { studCount: 4, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, loadsN: LOADS }] }, t));
const stored = async (runId: number) => {
  const [row] = await sequelize.query<{ final_gasket_stress_mpa: number | null; gasket_min_seating_mpa: number | null }>('SELECT final_gasket_stress_mpa, gasket_min_seating_mpa FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
  return { stress: row!.final_gasket_stress_mpa === null ? null : Number(row!.final_gasket_stress_mpa), seating: row!.gasket_min_seating_mpa === null ? null : Number(row!.gasket_min_seating_mpa) };
};

describe('runs.final_gasket_stress_mpa', () => {
  it('is stored with a run, and the back-fill the migration runs gives the same number', async () => {
    // Ring 100/150 mm: A = 3125π mm²; final loads sum 200,000 N; σ = 200,000 / 3125π = 64/π ≈ 20.372 MPa (hand-worked).
    const { id } = await saveJoint(admin, null, { ...fourStudJoint(`${TAG} ring`), gasket: { ...NO_GASKET_DATA, innerMm: 100, outerMm: 150, minSeatingMpa: 69, maxMpa: 207, stressSource: 'training default: set your own' } });
    const runId = await store(id);
    const first = await stored(runId);
    expect(first.stress).toBeCloseTo(64 / Math.PI, 9);
    expect(first.seating).toBe(69);

    await sequelize.query('UPDATE runs SET final_gasket_stress_mpa = NULL, gasket_min_seating_mpa = NULL WHERE id = ?', { replacements: [runId] });
    expect(await refreshGasketFigures(sequelize, {})).toBeGreaterThanOrEqual(1);
    expect(await stored(runId)).toEqual(first);
  });

  it('is null for a joint without a gasket contact area', async () => {
    const { id } = await saveJoint(admin, null, fourStudJoint(`${TAG} bare`));
    expect(await stored(await store(id))).toEqual({ stress: null, seating: null });
  });

  it('keeps the gasket as recorded after an edit, but follows the joint for a version made before gaskets were snapshotted', async () => {
    const ring = (innerMm: number, minSeatingMpa: number | null = null) => ({ ...fourStudJoint(`${TAG} edited`), gasket: { ...NO_GASKET_DATA, innerMm, outerMm: 150, minSeatingMpa } });
    const { id } = await saveJoint(admin, null, ring(100));
    const runId = await store(id);
    // An edit to a 120/150 mm ring leaves the run on its recorded 100/150 mm ring: 64/π MPa (hand-worked above).
    await saveJoint(admin, id, ring(120), (await getJoint(admin, id))!.version);
    expect((await stored(runId)).stress).toBeCloseTo(64 / Math.PI, 9);
    // Make the run's version look like one made before gaskets were snapshotted; the next edit (ring 110/150 mm,
    // seating 30 MPa) then carries over: A = π/4 (150² − 110²) = 2600π mm²; σ = 200,000 / 2600π ≈ 24.485 MPa (hand-worked).
    await sequelize.query("UPDATE joint_versions v JOIN runs r ON r.joint_version_id = v.id SET v.snapshot = JSON_REMOVE(v.snapshot, '$.gasket') WHERE r.id = ?", { replacements: [runId] });
    await saveJoint(admin, id, ring(110, 30), (await getJoint(admin, id))!.version);
    const after = await stored(runId);
    expect(after.stress).toBeCloseTo(200_000 / (2600 * Math.PI), 9);
    expect(after.stress).toBeCloseTo(24.485, 3);
    expect(after.seating).toBe(30);
  });
});
