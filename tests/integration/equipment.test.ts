import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { listEquipment, runTools, saveEquipment, setRunTools } from '@/lib/data/equipment';
import { storeRun } from '@/lib/data/runs/store-run';
import type { SessionUser } from '@/lib/auth/session';

const TAG = `itest-equipment-${Date.now()}`;
// Users of the demo seed: 1 admin, 2 instructor.
const admin: SessionUser = { id: 1, name: 'Admin', email: 'admin@demo.evenload.test', role: 'admin', units: 'si' };
const instructor: SessionUser = { id: 2, name: 'Instructor', email: 'i@demo.evenload.test', role: 'instructor', units: 'si' };
let runId = 0;
let heldRunId = 0;

afterAll(async () => {
  for (const id of [runId, heldRunId].filter(Boolean)) await sequelize.query('DELETE FROM runs WHERE id = ?', { replacements: [id] });
  await sequelize.query('DELETE FROM equipment WHERE name LIKE ?', { replacements: [`${TAG}%`] });
  await sequelize.close();
});

const tool = (name: string, dueOn: string | null) => ({ kind: 'torque_wrench' as const, name: `${TAG} ${name}`, serialNumber: `${TAG}-${name}`, certificate: null, calibratedOn: null, dueOn, inService: true });

describe('the equipment register against MariaDB', () => {
  it('records the tools of a run and flags the one past due on the day of the run', async () => {
    const inDate = await saveEquipment(admin, null, tool('A', '2026-12-31'));
    const late = await saveEquipment(admin, null, tool('B', '2026-05-31'));
    await expect(saveEquipment(instructor, null, tool('C', null))).rejects.toMatchObject({ code: 'forbidden' });
    await expect(saveEquipment(admin, null, tool('A', null))).rejects.toMatchObject({ code: 'conflict' });
    runId = await sequelize.transaction((t) =>
      storeRun(
        { jointId: 1, methodId: 1, lubricantId: 1, operatorId: admin.id, cohortId: null, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date('2026-06-15T10:00:00Z') },
        { studCount: 8, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, loadsN: [50_000, 49_000, 51_000, 50_000, 50_000, 49_000, 51_000, 50_000] }] },
        t,
      ),
    );
    await setRunTools(admin, runId, [inDate.id, late.id]);
    const tools = await runTools(admin, runId);
    expect(tools.map((t) => [t.id, t.pastDue])).toEqual([[inDate.id, false], [late.id, true]]);
    expect((await listEquipment(instructor)).filter((e) => e.name.startsWith(TAG))).toHaveLength(2);
    await expect(setRunTools(admin, runId, [999_999])).rejects.toMatchObject({ code: 'invalid_input' });
    expect(await runTools(admin, runId)).toHaveLength(2); // the refused change left the tools as they were
  });

  it('holds a complete run for review when a tool was past due on its day, and releases it when the tool is taken off', async () => {
    const inDate = (await listEquipment(admin)).find((e) => e.name === `${TAG} A`)!;
    const late = (await listEquipment(admin)).find((e) => e.name === `${TAG} B`)!;
    heldRunId = await sequelize.transaction((t) =>
      storeRun(
        { jointId: 1, methodId: 1, lubricantId: 1, operatorId: admin.id, cohortId: null, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date('2026-06-15T10:00:00Z') },
        { studCount: 8, targetLoadN: 50_000, steps: [{ order: 1, pass: 1, position: 1, loadsN: [50_000, 49_000, 51_000, 50_000, 50_000, 49_000, 51_000, 50_000] }] },
        t,
      ),
    );
    // Stand for a run that passed the check when stored: complete, no reasons.
    await sequelize.query("UPDATE runs SET status = 'complete', review_reasons = NULL WHERE id = ?", { replacements: [heldRunId] });
    const state = async () => {
      const [[row]] = (await sequelize.query('SELECT status, review_reasons FROM runs WHERE id = ?', { replacements: [heldRunId] })) as [{ status: string; review_reasons: string | null }[], unknown];
      return { status: row!.status, rules: row!.review_reasons ? (JSON.parse(row!.review_reasons) as { rule: string }[]).map((r) => r.rule) : [] };
    };
    const audits = async () => ((await sequelize.query("SELECT action FROM audit_log WHERE object_type = 'run' AND object_id = ? ORDER BY id", { replacements: [heldRunId] })) as [{ action: string }[], unknown])[0].map((r) => r.action);

    await setRunTools(admin, heldRunId, [inDate.id]);
    expect(await state()).toEqual({ status: 'complete', rules: [] });
    expect(await audits()).toEqual([]);

    await setRunTools(admin, heldRunId, [inDate.id, late.id]);
    expect(await state()).toEqual({ status: 'needs_review', rules: ['tool_past_due'] });

    await setRunTools(admin, heldRunId, [inDate.id]);
    expect(await state()).toEqual({ status: 'complete', rules: [] });
    expect(await audits()).toEqual(['tool_check', 'tool_check']);

    // A run held for another reason stays held when the late tool comes off; only the tool reason goes.
    await sequelize.query(`UPDATE runs SET status = 'needs_review', review_reasons = '[{"rule":"passes","message":"m"}]' WHERE id = ?`, { replacements: [heldRunId] });
    await setRunTools(admin, heldRunId, [late.id]);
    expect(await state()).toEqual({ status: 'needs_review', rules: ['passes', 'tool_past_due'] });
    await setRunTools(admin, heldRunId, []);
    expect(await state()).toEqual({ status: 'needs_review', rules: ['passes'] });
  });
});
