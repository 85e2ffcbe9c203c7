import { readFileSync } from 'node:fs';
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { getJoint, saveJoint } from '@/lib/data/joints';
import { calibrationHistory, recordCalibration } from '@/lib/data/calibration';
import { correctCalibration, runFigureHistory } from '@/lib/data/calibration-correction';
import { loadRun } from '@/lib/data/run-report';
import { storeRun } from '@/lib/data/runs/store-run';
import { storeUploadedRun } from '@/lib/data/runs/upload-run';
import { calibrationSession as session, fourStudJoint as jointInput, tableFor } from './calibration-fixture';
import type { SessionUser } from '@/lib/auth/session';

const TAG = `itest-pinning-${Date.now()}`;
// User 1 of the demo seed is the admin.
const admin: SessionUser = { id: 1, name: 'Test admin', email: 'test@demo.evenload.test', role: 'admin', units: 'si' };
// User 2 is an instructor: admins do not record runs.
const instructor: SessionUser = { id: 2, name: 'Test instructor', email: 'test2@demo.evenload.test', role: 'instructor', units: 'si' };

afterAll(async () => {
  await sequelize.query('DELETE r FROM runs r JOIN joints j ON j.id = r.joint_id WHERE j.name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM joints WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});



const firstId = async (sql: string) => Number((await sequelize.query<{ id: number }>(sql, { type: QueryTypes.SELECT }))[0]!.id);
const header = async (jointId: number) => ({
  jointId, methodId: await firstId('SELECT id FROM methods ORDER BY id LIMIT 1'), lubricantId: await firstId('SELECT id FROM lubricants ORDER BY id LIMIT 1'),
  operatorId: instructor.id, cohortId: null, recordedAt: '2026-09-01T10:00', notes: null,
});
// The microstrain logger file of the ingest tests (invented), made unique per upload by its comment line.
const MICROSTRAIN = readFileSync('tests/ingest/good/microstrain.csv', 'utf8');
async function upload(jointId: number, label: string): Promise<number> {
  const bytes = new TextEncoder().encode(MICROSTRAIN.replace('# Invented', `# ${TAG} ${label}. Invented`));
  return (await storeUploadedRun(instructor, { bytes, fileName: `${label}.csv`, contentType: 'text/csv', mapping: null, acceptGuess: false, header: await header(jointId) })).runId;
}
const finalLoads = async (runId: number) => JSON.parse(String((await sequelize.query<{ final_loads_json: string }>('SELECT final_loads_json FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [runId] }))[0]!.final_loads_json)) as number[];

describe('runs pinned to the joint version and calibration they were recorded with', () => {
  it('a run keeps its joint version after the joint is edited; a new run gets the new version', async () => {
    const { id } = await saveJoint(admin, null, jointInput(`${TAG} edited`));
    const before = await sequelize.transaction((t) => storeRun({ ...{ jointId: id, methodId: 1, lubricantId: 1, operatorId: admin.id, cohortId: null }, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date() },
      { studCount: 4, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, loadsN: [50_000, 49_000, 51_000, 50_000] }] }, t));
    const joint = await getJoint(admin, id);
    // The edit also gives the joint a gasket ring (ID 120 mm, OD 150 mm: area π/4·(150² − 120²) = 6,361.7 mm², hand-worked).
    const ring = { ...jointInput('x').gasket, innerMm: 120, outerMm: 150 };
    await saveJoint(admin, id, { ...jointInput(`${TAG} edited, renamed`, 'ring-joint'), gasket: ring }, joint!.version);
    const old = await loadRun(admin, before);
    expect(old.header.joint.name).toBe(`${TAG} edited`);
    expect(old.header.joint.gasketType).toBe('spiral-wound');
    expect(old.header.joint.versionNumber).toBe(1);
    expect(old.header.joint.gasket).toBeNull(); // recorded with no gasket data: the later ring is not the run's
    const after = await sequelize.transaction((t) => storeRun({ jointId: id, methodId: 1, lubricantId: 1, operatorId: admin.id, cohortId: null, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date() },
      { studCount: 4, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, loadsN: [50_000, 49_000, 51_000, 50_000] }] }, t));
    const current = await loadRun(admin, after);
    expect(current.header.joint.gasketType).toBe('ring-joint');
    expect(current.header.joint.versionNumber).toBe(2);
    expect(current.header.joint.gasket?.areaMm2).toBeCloseTo((Math.PI / 4) * (150 ** 2 - 120 ** 2), 6);
  });

  it('correcting a calibration recomputes exactly the runs pinned to it that kept their file, old figures kept beside the new', async () => {
    const a = (await saveJoint(admin, null, jointInput(`${TAG} A`))).id;
    const b = (await saveJoint(admin, null, jointInput(`${TAG} B`))).id;
    const sessionA = await recordCalibration(admin, a, session('2026-02-01', [1, 1.02, 0.98, 1]));
    await recordCalibration(admin, b, session('2026-02-01', [1, 1.02, 0.98, 1]));
    const affected = [await upload(a, 'a1'), await upload(a, 'a2')];
    const otherJoint = await upload(b, 'b1');
    const manual = await sequelize.transaction((t) => storeRun({ jointId: a, methodId: 1, lubricantId: 1, operatorId: admin.id, cohortId: null, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date() },
      { studCount: 4, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, loadsN: [50_000, 49_000, 51_000, 50_000] }] }, t));
    const pinned = await sequelize.query<{ id: number; calibration_session_id: number }>('SELECT id, calibration_session_id FROM runs WHERE id IN (?)', { type: QueryTypes.SELECT, replacements: [[...affected, manual]] });
    expect(pinned.map((r) => Number(r.calibration_session_id))).toEqual([sessionA.id, sessionA.id, sessionA.id]);
    const untouched = { otherJoint: await finalLoads(otherJoint), manual: await finalLoads(manual) };
    const oldLoads = await finalLoads(affected[0]!);
    const oldFactor = (await calibrationHistory(admin, a))[0]!.results[2]!.factor;

    const history = (await calibrationHistory(admin, a))[0]!;
    const result = await correctCalibration(admin, sessionA.id, { table: tableFor([1, 1.02, 0.9, 1]), reason: 'Position 3 column typed from the wrong sheet' }, history.version);
    expect(result.changedRunIds).toEqual(affected);
    const newFactor = (await calibrationHistory(admin, a))[0]!.results[2]!.factor;
    // Microstrain loads are F = E·ε·A·factor (lib/ingest/units.ts), so position 3 scales by new/old factor; the others stay.
    const newLoads = await finalLoads(affected[0]!);
    expect(newLoads[2]).toBeCloseTo((oldLoads[2]! * newFactor) / oldFactor, 6);
    expect(newLoads[0]).toBeCloseTo(oldLoads[0]!, 9);
    expect(await finalLoads(otherJoint)).toEqual(untouched.otherJoint);
    expect(await finalLoads(manual)).toEqual(untouched.manual);
    const kept = await runFigureHistory(affected[0]!);
    expect(kept).toHaveLength(1);
    expect(JSON.parse(String(kept[0]!.oldFigures.finalLoadsJson))).toEqual(oldLoads);
    expect(kept[0]!.reason).toBe('Position 3 column typed from the wrong sheet');
    expect(await runFigureHistory(otherJoint)).toEqual([]);
    expect((await getJoint(admin, a))!.positions[2]!.calibrationFactor).toBeCloseTo(newFactor, 12);
    // The audit log has the correction and one recompute row per changed run, in the same transaction.
    const audit = await sequelize.query<{ object_type: string; object_id: number; action: string; reason: string }>(
      "SELECT object_type, object_id, action, reason FROM audit_log WHERE (object_type = 'calibration_session' AND object_id = ?) OR (object_type = 'run' AND action = 'recompute' AND object_id IN (?)) ORDER BY id",
      { type: QueryTypes.SELECT, replacements: [sessionA.id, [...affected, otherJoint, manual]] },
    );
    expect(audit.map((r) => [r.object_type, Number(r.object_id), r.action])).toEqual([...affected.map((id) => ['run', id, 'recompute']), ['calibration_session', sessionA.id, 'correct']]);
    expect(new Set(audit.map((r) => r.reason))).toEqual(new Set(['Position 3 column typed from the wrong sheet']));
  });
});
