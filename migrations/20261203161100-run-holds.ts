import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Hold readings: every stud's load at stated times after a pass (usually the last), kept per run,
 * pass held after, elapsed seconds and position. A pass that follows a hold is a retightening pass.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('run_holds', {
    run_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    after_pass: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    elapsed_s: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
    position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    load_n: { type: DataTypes.DOUBLE, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('run_holds');
};
