import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { buildDemoScenario } from '../demo/demo-scenario';
import { demoGasketOf } from '../demo/demo-library';
import { DEMO_EMAIL_DOMAIN } from '../demo/notice';
import { recordJointVersion } from './joint-versions';
import { refreshGasketFigures } from './runs/gasket-figures';

/**
 * Gives the demo joints their invented gasket (lib/demo/demo-library.ts `demoGasketOf`) where a
 * database seeded before gaskets existed left them without contact data, and back-fills the stored
 * gasket figures of the demo joints' runs that have none (`refreshGasketFigures`, touching
 * `updated_at` so cached comparisons recompute). Only when the demo school is loaded (an account of
 * DEMO_EMAIL_DOMAIN exists), only joints with the demo names, and never over gasket data a centre has
 * entered (any of inner, outer or area set leaves the joint's gasket as it is). Raw SQL and the
 * caller's connection, so the seeder runs it. Idempotent.
 * @returns the joints given a gasket and the runs whose figures changed.
 */
export async function backfillDemoGaskets(db: Sequelize, transaction: Transaction): Promise<{ joints: number; runs: number }> {
  const select = <T extends object>(sql: string, replacements: unknown[]) => db.query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });
  const [demo] = await select<{ n: number }>('SELECT COUNT(*) AS n FROM users WHERE email LIKE ?', [`%@${DEMO_EMAIL_DOMAIN}`]);
  if (!Number(demo?.n)) return { joints: 0, runs: 0 };
  let joints = 0;
  let runs = 0;
  for (const joint of buildDemoScenario().joints) {
    const gasket = demoGasketOf(joint.key);
    const [row] = await select<{ id: number; bare: number }>(
      'SELECT id, (gasket_inner_mm IS NULL AND gasket_outer_mm IS NULL AND gasket_area_mm2 IS NULL) AS bare FROM joints WHERE name = ? ORDER BY id LIMIT 1 FOR UPDATE',
      [joint.name],
    );
    if (!row || !gasket) continue;
    if (Number(row.bare)) {
      await db.query(
        `UPDATE joints SET gasket_inner_mm = ?, gasket_outer_mm = ?, gasket_min_seating_mpa = COALESCE(gasket_min_seating_mpa, ?), gasket_max_mpa = COALESCE(gasket_max_mpa, ?),
           gasket_stress_source = COALESCE(gasket_stress_source, ?), flange_facing = COALESCE(flange_facing, ?), version = version + 1, updated_at = NOW() WHERE id = ?`,
        { replacements: [gasket.innerMm, gasket.outerMm, gasket.minSeatingMpa, gasket.maxMpa, gasket.source, gasket.flangeFacing, row.id], transaction },
      );
      await recordJointVersion(Number(row.id), transaction);
      joints++;
    }
    const missing = (await select<{ id: number }>('SELECT id FROM runs WHERE joint_id = ? AND final_gasket_stress_mpa IS NULL', [row.id])).map((r) => Number(r.id));
    runs += await refreshGasketFigures(db, { runIds: missing, touch: true }, transaction);
  }
  return { joints, runs };
}
