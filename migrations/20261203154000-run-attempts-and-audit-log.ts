import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Who recorded each run (`recorded_by_id`; the way in is the existing `source`), the attempt
 * confirmation an instructor gives a run a trainee recorded (`assessed_confirmed_by_id`, `_at`),
 * and the audit log (`audit_log`: who, when, object, action, before and after).
 *
 * Backfill of existing rows: a run with a verdict was recorded by the instructor who signed it off
 * (the sign-off was the witness); any other non-simulated run in a cohort by the cohort's
 * instructor; everything else by its operator.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('runs', 'recorded_by_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' });
  await qi.addColumn('runs', 'assessed_confirmed_by_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' });
  await qi.addColumn('runs', 'assessed_confirmed_at', { type: DataTypes.DATE, allowNull: true });
  await qi.sequelize.query('UPDATE runs r JOIN run_verdicts v ON v.run_id = r.id SET r.recorded_by_id = v.signed_by_id');
  await qi.sequelize.query(
    "UPDATE runs r JOIN cohorts c ON c.id = r.cohort_id SET r.recorded_by_id = c.instructor_id WHERE r.recorded_by_id IS NULL AND r.source <> 'simulated'",
  );
  await qi.sequelize.query('UPDATE runs SET recorded_by_id = operator_id WHERE recorded_by_id IS NULL');
  await qi.createTable('audit_log', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    actor_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    actor_name: { type: DataTypes.STRING(160), allowNull: false },
    object_type: { type: DataTypes.STRING(40), allowNull: false },
    object_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    action: { type: DataTypes.STRING(40), allowNull: false },
    reason: { type: DataTypes.STRING(400), allowNull: true },
    before_json: { type: DataTypes.TEXT('long'), allowNull: true },
    after_json: { type: DataTypes.TEXT('long'), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('audit_log', ['object_type', 'object_id', 'id'], { name: 'audit_log_object' });
  await qi.addIndex('audit_log', ['created_at'], { name: 'audit_log_created' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('audit_log');
  await qi.removeColumn('runs', 'assessed_confirmed_at');
  await qi.removeColumn('runs', 'assessed_confirmed_by_id');
  await qi.removeColumn('runs', 'recorded_by_id');
};
