/**
 * "Changed since frozen" on a saved comparison's page: told from the runs' fingerprint (ids and last
 * changes) while it is the stored one, from the rebuilt data tables (hashed as the package is) when
 * a run was touched; a real change to a reading shows, a touch that changed no data does not.
 */
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { savedComparison } from '@/lib/data/saved-comparisons';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { freezeDemoComparison } from '../support/saved-comparison';
import { sessionUserFor } from './support';

let slug: string;
let remove: () => Promise<void>;
let user: SessionUser;

const storedFingerprint = async () => (await sequelize.query<{ f: string | null }>('SELECT runs_fingerprint AS f FROM saved_comparisons WHERE slug = ?', { type: QueryTypes.SELECT, replacements: [slug] }))[0]!.f;

beforeAll(async () => {
  ({ slug, remove } = await freezeDemoComparison('Methods on simulated runs (changed test)'));
  user = await sessionUserFor(DEMO_ACCOUNTS.researcher);
});

afterAll(async () => {
  await remove();
  await sequelize.close();
});

describe('a saved comparison changed since frozen', () => {
  it('is unchanged right after freezing, from the fingerprint stored with it', async () => {
    const first = await storedFingerprint();
    expect(first).toMatch(/^[0-9a-f]{64}$/);
    const view = await savedComparison(user, slug);
    expect(view.dataChanged).toBe(false);
    // Nothing was rebuilt: the package builds its tables itself.
    expect(view.tables).toBeNull();
  });

  it('stays unchanged when a run is touched without a change to its data, and keeps the new fingerprint', async () => {
    const before = await storedFingerprint();
    const runId = (await savedComparison(user, slug)).runs[0]!.id;
    await sequelize.query('UPDATE runs SET updated_at = updated_at + INTERVAL 1 SECOND WHERE id = ?', { replacements: [runId] });
    const view = await savedComparison(user, slug);
    expect(view.dataChanged).toBe(false);
    expect(view.tables).not.toBeNull();
    expect(await storedFingerprint()).not.toBe(before);
    expect((await savedComparison(user, slug)).tables).toBeNull();
  });

  it('shows a changed reading, also without a fingerprint (a comparison frozen before it existed)', async () => {
    const runId = (await savedComparison(user, slug)).runs[1]!.id;
    const [reading] = await sequelize.query<{ step_id: number; position: number; load_n: number }>('SELECT step_id, position, load_n FROM readings WHERE run_id = ? ORDER BY step_id, position LIMIT 1', { type: QueryTypes.SELECT, replacements: [runId] });
    await sequelize.query('UPDATE readings SET load_n = load_n + 1 WHERE step_id = ? AND position = ?', { replacements: [reading!.step_id, reading!.position] });
    await sequelize.query('UPDATE runs SET updated_at = updated_at + INTERVAL 1 SECOND WHERE id = ?', { replacements: [runId] });
    try {
      expect((await savedComparison(user, slug)).dataChanged).toBe(true);
      await sequelize.query('UPDATE saved_comparisons SET runs_fingerprint = NULL WHERE slug = ?', { replacements: [slug] });
      expect((await savedComparison(user, slug)).dataChanged).toBe(true);
    } finally {
      await sequelize.query('UPDATE readings SET load_n = ? WHERE step_id = ? AND position = ?', { replacements: [reading!.load_n, reading!.step_id, reading!.position] });
    }
    // The reading restored: the data hashes as frozen again.
    expect((await savedComparison(user, slug)).dataChanged).toBe(false);
  });
});
