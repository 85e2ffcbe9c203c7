import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { storeRunWithStatus } from '@/lib/data/runs/store-run';
import { loadRun } from '@/lib/data/run-report';
import { studTransfers } from '@/lib/calc/tensioner-coverage';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { createTestMethod, dropTestMethods } from '../support/record-fixtures';

// A 50 % tool coverage run of an invented two-pass tensioner method with 50 % coverage on an 8-stud joint, invented loads:
// each pull applies 1.2 × the residual it leaves (so every measured LTF is 1.2 by construction).
const ODD = [1, 3, 5, 7];
const EVEN = [2, 4, 6, 8];
let admin: SessionUser;
let runId = 0;
let methodId = 0;

async function tensioningRun(targetLoadN: number): Promise<NormalisedRun> {
  const loads = new Array<number>(8).fill(0);
  const steps: NormalisedRun['steps'] = [];
  for (const pass of [1, 2]) {
    for (const group of [ODD, EVEN]) {
      const residual = targetLoadN * (pass === 1 ? 0.97 : 1);
      for (const p of group) loads[p - 1] = residual;
      steps.push({ order: steps.length + 1, pass, position: group[0]!, appliedPressureBar: 800, loadsN: [...loads], covers: group.map((position) => ({ position, appliedN: residual * 1.2, residualN: residual })) });
    }
  }
  return { studCount: 8, targetLoadN, steps };
}

beforeAll(async () => {
  const [u] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.admin] });
  admin = { id: u!.id, name: u!.name, email: DEMO_ACCOUNTS.admin, role: 'admin', units: 'si' };
});

afterAll(async () => {
  if (runId) await sequelize.query('DELETE FROM runs WHERE id = ?', { replacements: [runId] });
  await dropTestMethods(methodId ? [methodId] : []);
  await sequelize.close();
});

describe('storing a tensioning run whose steps cover several studs', () => {
  it('stores it complete, with the applied and residual load of every stud each step covered, and reads it back', async () => {
    const [joint] = await sequelize.query<{ id: number; target_load_n: number }>('SELECT id, target_load_n FROM joints WHERE stud_count = 8 ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
    // Stored order: the 8-stud star (common practice); the tool set on every second stud does not follow it.
    methodId = await createTestMethod('Tensioner 50 % (storing)', [100, 100], { coverage: 'every_second_stud', orders: { '8': [1, 5, 3, 7, 2, 6, 4, 8] } });
    const [lubricant] = await sequelize.query<{ id: number }>('SELECT id FROM lubricants ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
    const target = Number(joint!.target_load_n);
    const run = await tensioningRun(target);
    const stored = await sequelize.transaction((transaction) =>
      storeRunWithStatus(
        { jointId: joint!.id, methodId, lubricantId: lubricant!.id, operatorId: admin.id, cohortId: null, targetLoadN: target, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date(), recordedById: admin.id, notes: 'Test tensioning run (invented).' },
        run,
        transaction,
      ),
    );
    runId = stored.runId;
    // Two passes of two steps (odd, then even studs) is what the run check asks of a 50 % tensioner method.
    expect(stored.reasons).toEqual([]);
    expect(stored.status).toBe('complete');
    const [count] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM step_positions WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    expect(Number(count!.n)).toBe(16);

    const loaded = await loadRun(admin, runId);
    expect(loaded.run.steps.map((s) => s.covers?.map((c) => c.position))).toEqual([ODD, EVEN, ODD, EVEN]);
    expect(loaded.run.steps[2]!.covers![0]).toEqual({ position: 1, appliedN: target * 1.2, residualN: target });
    const transfers = studTransfers(loaded.run);
    expect(transfers).toHaveLength(8);
    for (const t of transfers) expect(t.measuredLtf).toBeCloseTo(1.2, 12);
    expect(loaded.header.tensionerRule?.ltf).toBeGreaterThanOrEqual(1.15);
  });

  it('refuses a cover outside the joint and stores nothing', async () => {
    const run = await tensioningRun(50_000);
    run.steps[0]!.covers![0]!.position = 9;
    const before = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM runs', { type: QueryTypes.SELECT });
    await expect(
      sequelize.transaction((transaction) =>
        storeRunWithStatus({ jointId: 1, methodId: 1, lubricantId: 1, operatorId: admin.id, cohortId: null, targetLoadN: 50_000, bandPercent: 10, source: 'manual', status: 'complete', recordedAt: new Date() }, run, transaction),
      ),
    ).rejects.toMatchObject({ code: 'invalid_input' });
    const after = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM runs', { type: QueryTypes.SELECT });
    expect(Number(after[0]!.n)).toBe(Number(before[0]!.n));
  });
});
