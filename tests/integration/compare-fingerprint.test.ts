/**
 * A comparison's fingerprint is taken two ways (lib/data/compare.ts): from the rows a comparison
 * computed now reads, and from one aggregate when a cached answer is checked. Both must give the same
 * text, or a repeat would never be served from the cache (and an ETag never answered 304), and a
 * change to the runs must change it. Checked for each source choice, with a hold reading and a
 * renamed group in play; the expected equalities are the cache's own contract, not a stored value.
 */
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { compareQuerySchema, compareRunsCached } from '@/lib/data/compare';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { sessionUserFor } from './support';

afterAll(() => sequelize.close());

const cacheRows = async () => Number((await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM comparison_cache', { type: QueryTypes.SELECT }))[0]!.n);

describe('the fingerprint of a comparison computed now and of a cached one', () => {
  for (const source of ['measured', 'simulated', 'both'] as const) {
    it(`agree for ${source} runs, so the repeat is a hit and a revalidation a 304`, async () => {
      const user = await sessionUserFor(DEMO_ACCOUNTS.researcher);
      const query = compareQuerySchema.parse({ by: 'method', source });
      await sequelize.query('DELETE FROM comparison_cache');
      // Never asked: computed from one read, its fingerprint taken from that read.
      const first = await compareRunsCached(user, query, null);
      expect(first.body).not.toBeNull();
      expect(await cacheRows()).toBe(1);
      const [stored] = await sequelize.query<{ created_at: Date }>('SELECT created_at FROM comparison_cache', { type: QueryTypes.SELECT });
      // Asked again: checked by the aggregate. A different text would recompute and store again.
      const again = await compareRunsCached(user, query, null);
      expect(again.etag).toBe(first.etag);
      expect(again.body).toBe(first.body);
      const [kept] = await sequelize.query<{ created_at: Date }>('SELECT created_at FROM comparison_cache', { type: QueryTypes.SELECT });
      expect(kept!.created_at).toEqual(stored!.created_at);
      expect(await compareRunsCached(user, query, first.etag)).toEqual({ etag: first.etag, body: null });
    });
  }

  it('changes when a hold reading or a group name changes, and agrees again after', async () => {
    const user = await sessionUserFor(DEMO_ACCOUNTS.researcher);
    const query = compareQuerySchema.parse({ by: 'method', source: 'both' });
    await sequelize.query('DELETE FROM comparison_cache');
    const before = await compareRunsCached(user, query, null);
    const [run] = await sequelize.query<{ id: number; pass_count: number }>("SELECT id, pass_count FROM runs WHERE status = 'complete' AND final_loads_json IS NOT NULL ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
    const [method] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM methods ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
    await sequelize.query('INSERT INTO run_holds (run_id, after_pass, elapsed_s, position, load_n) VALUES (?, ?, 99999, 1, 12345)', { replacements: [run!.id, run!.pass_count] });
    try {
      const held = await compareRunsCached(user, query, before.etag);
      expect(held.body).not.toBeNull();
      expect(held.etag).not.toBe(before.etag);
      await sequelize.query('UPDATE methods SET name = ?, updated_at = NOW() + INTERVAL 2 SECOND WHERE id = ?', { replacements: [`${method!.name} (renamed)`, method!.id] });
      const renamed = await compareRunsCached(user, query, held.etag);
      expect(renamed.etag).not.toBe(held.etag);
      expect(renamed.body).toContain('(renamed)');
      // The answer computed after the change is found again by the aggregate.
      expect(await compareRunsCached(user, query, renamed.etag)).toEqual({ etag: renamed.etag, body: null });
    } finally {
      await sequelize.query('DELETE FROM run_holds WHERE run_id = ? AND elapsed_s = 99999', { replacements: [run!.id] });
      await sequelize.query('UPDATE methods SET name = ? WHERE id = ?', { replacements: [method!.name, method!.id] });
      await sequelize.query('DELETE FROM comparison_cache');
    }
  });
});
