import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Steps that tighten several studs at once (a hydraulic tensioner with 100 % or 50 % tool
 * coverage): one row per stud the step covered, with the tool's applied load (peak while
 * pressurised) and the residual load after release. A one-stud torque step has no rows here.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('step_positions', {
    step_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'tightening_steps', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    run_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    applied_n: { type: DataTypes.DOUBLE, allowNull: false },
    residual_n: { type: DataTypes.DOUBLE, allowNull: false },
  });
  await qi.addIndex('step_positions', ['run_id'], { name: 'step_positions_run' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('step_positions');
};
