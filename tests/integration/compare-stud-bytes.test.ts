/**
 * The per-stud figures a comparison reads: every run stored with final loads (and drift) also has
 * them as float64 bytes holding exactly the numbers of its JSON columns, and a comparison gives the
 * same answer, to the byte, from the bytes as from the JSON (the path for a run without bytes).
 */
import { QueryTypes } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { compareQuerySchema, compareRunsJson } from '@/lib/data/compare';
import { decodeFloat64Blob } from '@/lib/record/float64-blob';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { sessionUserFor } from './support';

afterAll(() => sequelize.close());

interface StudRow {
  id: number;
  final_loads_json: string | null;
  drift_json: string | null;
  final_loads_f64: Uint8Array | null;
  drift_f64: Uint8Array | null;
}

describe('stored stud figures as float64 bytes', () => {
  it('hold the same numbers as the JSON columns for every stored run', async () => {
    const rows = await sequelize.query<StudRow>('SELECT id, final_loads_json, drift_json, final_loads_f64, drift_f64 FROM runs WHERE final_loads_json IS NOT NULL', { type: QueryTypes.SELECT });
    expect(rows.length).toBeGreaterThan(10);
    for (const row of rows) {
      expect(decodeFloat64Blob(row.final_loads_f64!)).toEqual(JSON.parse(row.final_loads_json!));
      if (row.drift_json) expect(decodeFloat64Blob(row.drift_f64!)).toEqual(JSON.parse(row.drift_json));
    }
  });

  it('give the same comparison as the JSON of runs stored before the bytes existed', async () => {
    const user = await sessionUserFor(DEMO_ACCOUNTS.researcher);
    const query = compareQuerySchema.parse({ by: 'method', source: 'simulated' });
    await sequelize.query('DELETE FROM comparison_cache');
    const fromBytes = await compareRunsJson(user, query);
    expect(JSON.parse(fromBytes).totalRuns).toBeGreaterThan(10);
    const saved = await sequelize.query<StudRow>("SELECT id, final_loads_f64, drift_f64 FROM runs WHERE source = 'simulated' AND final_loads_f64 IS NOT NULL", { type: QueryTypes.SELECT });
    await sequelize.query("UPDATE runs SET final_loads_f64 = NULL, drift_f64 = NULL WHERE source = 'simulated'");
    try {
      await sequelize.query('DELETE FROM comparison_cache');
      expect(await compareRunsJson(user, query)).toBe(fromBytes);
    } finally {
      for (const row of saved) await sequelize.query('UPDATE runs SET final_loads_f64 = ?, drift_f64 = ? WHERE id = ?', { replacements: [row.final_loads_f64, row.drift_f64, row.id] });
      await sequelize.query('DELETE FROM comparison_cache');
    }
  });
});
