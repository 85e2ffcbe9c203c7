import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { compareQuerySchema, compareRunsJson, type CompareResponse } from '@/lib/data/compare';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';

afterAll(() => sequelize.close());

async function researcher(): Promise<SessionUser> {
  const [row] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', { type: QueryTypes.SELECT, replacements: [DEMO_ACCOUNTS.researcher] });
  return { id: row!.id, name: row!.name, email: DEMO_ACCOUNTS.researcher, role: 'researcher', units: 'si' };
}

describe('compareRunsJson', () => {
  it('counts the same complete measured runs per method as SQL does, and leaves set-aside runs out', async () => {
    const user = await researcher();
    const result = JSON.parse(await compareRunsJson(user, compareQuerySchema.parse({ by: 'method' }))) as CompareResponse;
    const sql = await sequelize.query<{ method_id: number; n: number }>("SELECT method_id, COUNT(*) AS n FROM runs WHERE status = 'complete' AND source IN ('upload', 'manual', 'live') AND final_loads_json IS NOT NULL GROUP BY method_id", { type: QueryTypes.SELECT });
    const byKey = new Map(sql.map((r) => [String(r.method_id), Number(r.n)]));
    for (const group of result.groups) expect(group.runs).toBe(byKey.get(group.key));
    expect(result.totalRuns).toBe([...byKey.values()].reduce((a, b) => a + b, 0));
  });

  it('serves a repeat from the shared cache and recomputes once the runs change', async () => {
    const user = await researcher();
    const query = compareQuerySchema.parse({ by: 'lubricant' });
    const first = await compareRunsJson(user, query);
    const [{ n: rows }] = (await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM comparison_cache', { type: QueryTypes.SELECT })) as [{ n: number }];
    expect(Number(rows)).toBeGreaterThan(0);
    expect(await compareRunsJson(user, query)).toBe(first);
    // Set one run aside: the fingerprint changes, so the comparison is computed again without it.
    const [run] = await sequelize.query<{ id: number }>("SELECT id FROM runs WHERE status = 'complete' ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
    await sequelize.query("UPDATE runs SET status = 'set_aside', set_aside_reason = 'test: gauge check', updated_at = NOW() + INTERVAL 1 SECOND WHERE id = ?", { replacements: [run!.id] });
    try {
      const second = JSON.parse(await compareRunsJson(user, query)) as CompareResponse;
      expect(second.totalRuns).toBe((JSON.parse(first) as CompareResponse).totalRuns - 1);
    } finally {
      await sequelize.query("UPDATE runs SET status = 'complete', set_aside_reason = NULL WHERE id = ?", { replacements: [run!.id] });
    }
  });
});

describe('compareRunsJson filters', () => {
  const count = async (sql: string, params: unknown[] = []) => Number((await sequelize.query<{ n: number }>(sql, { type: QueryTypes.SELECT, replacements: params }))[0]!.n);

  it('leaves simulated runs out unless they are asked for, and says how many', async () => {
    const user = await researcher();
    const measured = JSON.parse(await compareRunsJson(user, compareQuerySchema.parse({ by: 'method' }))) as CompareResponse;
    const simulated = JSON.parse(await compareRunsJson(user, compareQuerySchema.parse({ by: 'method', source: 'simulated' }))) as CompareResponse;
    const nMeasured = await count("SELECT COUNT(*) AS n FROM runs WHERE status = 'complete' AND final_loads_json IS NOT NULL AND source IN ('upload', 'manual', 'live')");
    const nSimulated = await count("SELECT COUNT(*) AS n FROM runs WHERE status = 'complete' AND final_loads_json IS NOT NULL AND source = 'simulated'");
    expect(nSimulated).toBeGreaterThan(0);
    expect(measured.source).toBe('measured');
    expect(measured.simulatedLeftOut).toBe(nSimulated);
    expect(simulated.source).toBe('simulated');
    // Up to 8 groups are shown; the demo has fewer methods, so every matching run is counted.
    expect(measured.totalRuns).toBe(nMeasured);
    expect(simulated.totalRuns).toBe(nSimulated);
  });

  it('takes every factor filter into SQL', async () => {
    const user = await researcher();
    const [run] = await sequelize.query<{ lubricant_id: number; operator_id: number; stud_count: number; joint_id: number }>(
      "SELECT lubricant_id, operator_id, stud_count, joint_id FROM runs WHERE status = 'complete' AND source = 'simulated' ORDER BY id LIMIT 1",
      { type: QueryTypes.SELECT },
    );
    const query = compareQuerySchema.parse({ by: 'method', source: 'simulated', lubricantId: String(run!.lubricant_id), operatorId: String(run!.operator_id), studCount: String(run!.stud_count), jointId: String(run!.joint_id) });
    const result = JSON.parse(await compareRunsJson(user, query)) as CompareResponse;
    const expected = await count(
      "SELECT COUNT(*) AS n FROM runs WHERE status = 'complete' AND final_loads_json IS NOT NULL AND source = 'simulated' AND lubricant_id = ? AND operator_id = ? AND stud_count = ? AND joint_id = ?",
      [run!.lubricant_id, run!.operator_id, run!.stud_count, run!.joint_id],
    );
    expect(result.totalRuns).toBe(expected);
    expect(result.studCounts).toEqual([run!.stud_count]);
  });
});
