import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';
import { refreshGasketFigures } from '../lib/data/runs/gasket-figures';

/**
 * Per-run gasket figures for compare: the average gasket stress after the final step (MPa, sum of
 * the final stud loads ÷ the contact area of the joint as recorded) and that joint's minimum seating
 * stress; both null when the joint has no contact area. Existing runs are back-filled in batches by
 * the same code that fills them when runs are stored (`lib/data/runs/gasket-figures.ts`); cached
 * comparisons, computed without these figures, are dropped.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('runs', 'final_gasket_stress_mpa', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('runs', 'gasket_min_seating_mpa', { type: DataTypes.DOUBLE, allowNull: true });
  await refreshGasketFigures(qi.sequelize, {});
  await qi.sequelize.query('DELETE FROM comparison_cache');
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('runs', 'gasket_min_seating_mpa');
  await qi.removeColumn('runs', 'final_gasket_stress_mpa');
  await qi.sequelize.query('DELETE FROM comparison_cache');
};
