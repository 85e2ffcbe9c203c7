/**
 * Demo data: the demo joints' gasket (an invented contact ring with the training stress limits, see
 * lib/demo/demo-library.ts) for databases seeded before joints had gasket data, and the stored gasket
 * figures of the demo runs, so the demo's Compare and Classroom show gasket stress. Idempotent; does
 * nothing without the demo school (lib/data/demo-gasket.ts).
 */
import { QueryTypes } from 'sequelize';
import type { Seeder } from '../lib/platform/migrator';
import { backfillDemoGaskets } from '../lib/data/demo-gasket';
import { refreshGasketFigures } from '../lib/data/runs/gasket-figures';
import { buildDemoScenario } from '../lib/demo/demo-scenario';
import { demoGasketOf } from '../lib/demo/demo-library';

export const up: Seeder = async ({ context: { sequelize } }) => {
  await sequelize.transaction((transaction) => backfillDemoGaskets(sequelize, transaction));
};

/** Takes the invented ring off demo joints that still carry exactly it (a centre's own entry stays), and refreshes their runs' figures. */
export const down: Seeder = async ({ context: { sequelize } }) => {
  await sequelize.transaction(async (transaction) => {
    for (const joint of buildDemoScenario().joints) {
      const gasket = demoGasketOf(joint.key);
      if (!gasket) continue;
      const rows = await sequelize.query<{ id: number }>('SELECT id FROM joints WHERE name = ? AND gasket_inner_mm = ? AND gasket_outer_mm = ?', { type: QueryTypes.SELECT, replacements: [joint.name, gasket.innerMm, gasket.outerMm], transaction });
      for (const { id } of rows) {
        await sequelize.query('UPDATE joints SET gasket_inner_mm = NULL, gasket_outer_mm = NULL, version = version + 1, updated_at = NOW() WHERE id = ?', { replacements: [id], transaction });
        await refreshGasketFigures(sequelize, { unsnapshottedOfJoint: Number(id), touch: true }, transaction);
      }
    }
  });
};
