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
  it('counts the same complete runs per method as SQL does, and leaves set-aside runs out', async () => {
    const user = await researcher();
    const result = JSON.parse(await compareRunsJson(user, compareQuerySchema.parse({ by: 'method' }))) as CompareResponse;
    const sql = await sequelize.query<{ method_id: number; n: number }>("SELECT method_id, COUNT(*) AS n FROM runs WHERE status = 'complete' GROUP BY method_id", { type: QueryTypes.SELECT });
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
