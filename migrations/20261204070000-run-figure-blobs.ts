import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';
import { float64BlobOfJson } from '../lib/record/float64-blob';

/**
 * The final loads and per-stud drift of each run also as float64 bytes (`lib/record/float64-blob.ts`),
 * so a comparison of thousands of runs reads 8 bytes a value instead of parsing JSON. Back-filled
 * here from the JSON columns (same numbers), in id batches; `updated_at` is left alone (the data did
 * not change).
 */
const BATCH = 500;

export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('runs', 'final_loads_f64', { type: DataTypes.BLOB, allowNull: true });
  await qi.addColumn('runs', 'drift_f64', { type: DataTypes.BLOB, allowNull: true });
  let after = 0;
  for (;;) {
    const rows = await qi.sequelize.query<{ id: number; final_loads_json: string | null; drift_json: string | null }>(
      'SELECT id, final_loads_json, drift_json FROM runs WHERE id > ? AND (final_loads_json IS NOT NULL OR drift_json IS NOT NULL) ORDER BY id LIMIT ?',
      { type: QueryTypes.SELECT, replacements: [after, BATCH] },
    );
    if (!rows.length) break;
    const blob = (json: string | null) => {
      const bytes = float64BlobOfJson(json);
      return bytes ? Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength) : null;
    };
    const ids = rows.map((r) => r.id);
    await qi.sequelize.query(
      `UPDATE runs SET final_loads_f64 = CASE id ${rows.map(() => 'WHEN ? THEN ?').join(' ')} END, drift_f64 = CASE id ${rows.map(() => 'WHEN ? THEN ?').join(' ')} END WHERE id IN (?)`,
      { replacements: [...rows.flatMap((r) => [r.id, blob(r.final_loads_json)]), ...rows.flatMap((r) => [r.id, blob(r.drift_json)]), ids] },
    );
    after = ids[ids.length - 1]!;
  }
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('runs', 'drift_f64');
  await qi.removeColumn('runs', 'final_loads_f64');
};
