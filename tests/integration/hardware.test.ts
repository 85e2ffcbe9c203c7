import { QueryTypes } from 'sequelize';
import { reviewRun } from '@/lib/data/runs/run-review';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { createHardwareSet, createLubricantLot, listHardware } from '@/lib/data/hardware';
import { resolveRunHeader } from '@/lib/data/record';
import { compareQuerySchema, compareRuns } from '@/lib/data/compare';
import { storeRun } from '@/lib/data/runs/store-run';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';

const TAG = `itest-hw-${Date.now()}`;
let instructor: SessionUser;
let base: { joint_id: number; method_id: number; lubricant_id: number; stud_count: number };
let otherLubricant: number;
const runIds: number[] = [];

beforeAll(async () => {
  const [u] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.instructor] });
  instructor = { id: u!.id, name: u!.name, email: DEMO_ACCOUNTS.instructor, role: 'instructor', units: 'si' };
  [base] = (await sequelize.query('SELECT joint_id, method_id, lubricant_id, stud_count FROM runs ORDER BY id LIMIT 1', { type: QueryTypes.SELECT })) as [typeof base];
  const [other] = await sequelize.query<{ id: number }>('SELECT id FROM lubricants WHERE id <> ? ORDER BY id LIMIT 1', { type: QueryTypes.SELECT, replacements: [base.lubricant_id] });
  otherLubricant = other!.id;
});

afterAll(async () => {
  if (runIds.length) await sequelize.query('DELETE FROM runs WHERE id IN (?)', { replacements: [runIds] });
  await sequelize.query('DELETE FROM lubricant_lots WHERE lot_code LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.query('DELETE FROM hardware_sets WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});

const header = (extra: Record<string, unknown>) => ({
  jointId: base.joint_id, methodId: base.method_id, lubricantId: base.lubricant_id, operatorId: instructor.id, cohortId: null, recordedAt: '2026-03-01T09:00', notes: null, ...extra,
});

describe('hardware sets and lubricant lots', () => {
  it('raises the set use count with each run and stamps each run with its use number', async () => {
    const { id: setId } = await createHardwareSet(instructor, { name: `${TAG} set A`, description: 'B7 studs, 2H nuts', conditionNotes: null });
    const { id: lotId } = await createLubricantLot(instructor, { lubricantId: base.lubricant_id, lotCode: `${TAG}-L1` });
    const run = { studCount: base.stud_count, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, appliedTorqueNm: null, appliedPressureBar: null, timeS: null, loadsN: Array.from({ length: base.stud_count }, () => 50_000) }] };
    for (let i = 0; i < 2; i += 1) {
      const resolved = await resolveRunHeader(instructor, header({ hardwareSetId: String(setId), lubricantLotId: String(lotId), gasketCondition: i === 0 ? 'new' : 'reused' }), 'manual', 'complete');
      runIds.push(await sequelize.transaction((t) => storeRun(resolved.header, run, t)));
    }
    const rows = await sequelize.query<{ hardware_use_number: number; gasket_condition: string; lubricant_lot_id: number }>(
      'SELECT hardware_use_number, gasket_condition, lubricant_lot_id FROM runs WHERE id IN (?) ORDER BY id', { type: QueryTypes.SELECT, replacements: [runIds] });
    expect(rows.map((r) => r.hardware_use_number)).toEqual([1, 2]);
    expect(rows.map((r) => r.gasket_condition)).toEqual(['new', 'reused']);
    expect(rows.every((r) => r.lubricant_lot_id === lotId)).toBe(true);
    expect((await listHardware(instructor)).sets.find((s) => s.id === setId)?.useCount).toBe(2);
    // One step is not the method's plan, so the check before a run counts holds both runs for review;
    // the instructor confirms them, as on the run report, and they count in comparisons.
    const held = await sequelize.query<{ id: number }>("SELECT id FROM runs WHERE id IN (?) AND status = 'needs_review'", { type: QueryTypes.SELECT, replacements: [runIds] });
    for (const { id } of held) await reviewRun(instructor, Number(id), { note: 'Test runs of one step, confirmed for the hardware check.' });
    const byUse = await compareRuns(instructor, compareQuerySchema.parse({ by: 'hardwareUse', operatorId: String(instructor.id), from: '2026-03-01', to: '2026-03-01' }));
    expect(byUse.groups.map((g) => g.label)).toEqual(['Use 1 of the set', 'Use 2 of the set']);
    const byLot = await compareRuns(instructor, compareQuerySchema.parse({ by: 'lubricantLot', ids: String(lotId) }));
    expect(byLot.groups[0]?.label).toMatch(new RegExp(`, lot ${TAG}-L1$`));
  });

  it('refuses a lot of another lubricant, and a set name twice', async () => {
    const { id: lotId } = await createLubricantLot(instructor, { lubricantId: otherLubricant, lotCode: `${TAG}-L2` });
    await expect(resolveRunHeader(instructor, header({ lubricantLotId: lotId }), 'manual', 'complete')).rejects.toMatchObject({ code: 'invalid_input', details: { field: 'lubricantLotId' } });
    await expect(createHardwareSet(instructor, { name: `${TAG} set A`, description: null, conditionNotes: null })).rejects.toMatchObject({ code: 'conflict' });
  });
});
