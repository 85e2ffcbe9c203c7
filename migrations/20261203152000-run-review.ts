import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * The run check (lib/run-check): a run that fails it is stored with status `needs_review` and its
 * reasons (`review_reasons`, JSON); an instructor or researcher confirms it with a note (who, when,
 * note kept) or sets it aside. `simulation_key` (sha256 of the normalised header, gasket and seed)
 * makes Simulate idempotent: unique, null for every other run. `down` sets runs still awaiting
 * review aside (they never counted) before the status goes.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.changeColumn('runs', 'status', { type: DataTypes.ENUM('draft', 'recording', 'complete', 'set_aside', 'needs_review'), allowNull: false });
  await qi.addColumn('runs', 'review_reasons', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('runs', 'reviewed_by_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  await qi.addConstraint('runs', { fields: ['reviewed_by_id'], type: 'foreign key', name: 'runs_reviewed_by_fk', references: { table: 'users', field: 'id' }, onDelete: 'SET NULL', onUpdate: 'CASCADE' });
  await qi.addColumn('runs', 'reviewed_at', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('runs', 'review_note', { type: DataTypes.STRING(1000), allowNull: true });
  await qi.addColumn('runs', 'simulation_key', { type: DataTypes.CHAR(64), allowNull: true });
  await qi.addIndex('runs', ['simulation_key'], { unique: true, name: 'runs_simulation_key' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("UPDATE runs SET status = 'set_aside', set_aside_reason = 'Held for review when the review status was removed.' WHERE status = 'needs_review'");
  await qi.removeIndex('runs', 'runs_simulation_key');
  await qi.removeColumn('runs', 'simulation_key');
  await qi.removeColumn('runs', 'review_note');
  await qi.removeColumn('runs', 'reviewed_at');
  await qi.removeConstraint('runs', 'runs_reviewed_by_fk');
  await qi.removeColumn('runs', 'reviewed_by_id');
  await qi.removeColumn('runs', 'review_reasons');
  await qi.changeColumn('runs', 'status', { type: DataTypes.ENUM('draft', 'recording', 'complete', 'set_aside'), allowNull: false });
};
