import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Issue 17 item 5: the job table any app instance may work (`jobs`, claimed with
 * SELECT … FOR UPDATE SKIP LOCKED), the refresher reminders sent (`refresher_reminders`, one per
 * record of training and valid-until date, written in the transaction that marks its job done) and
 * the cohort's lead time (`cohorts.refresher_lead_days`, 90 days unless the centre sets its own).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('cohorts', 'refresher_lead_days', { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 90 });
  await qi.createTable('jobs', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    payload: { type: DataTypes.TEXT, allowNull: false },
    dedupe_key: { type: DataTypes.STRING(191), allowNull: false, unique: true },
    status: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'queued' },
    run_after: { type: DataTypes.DATE(3), allowNull: false },
    attempts: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
    max_attempts: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 8 },
    last_error: { type: DataTypes.STRING(1000), allowNull: true },
    locked_by: { type: DataTypes.STRING(80), allowNull: true },
    locked_until: { type: DataTypes.DATE(3), allowNull: true },
    finished_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  // The claim reads due queued jobs in run_after order; recovery reads running jobs by lock expiry.
  await qi.addIndex('jobs', ['status', 'run_after'], { name: 'jobs_status_run_after' });
  await qi.addIndex('jobs', ['status', 'locked_until'], { name: 'jobs_status_locked_until' });
  await qi.createTable('refresher_reminders', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    training_record_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'training_records', key: 'id' }, onDelete: 'CASCADE' },
    valid_until: { type: DataTypes.DATEONLY, allowNull: false },
    job_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    sent_to: { type: DataTypes.STRING(254), allowNull: false },
    message_id: { type: DataTypes.STRING(200), allowNull: false },
    sent_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('refresher_reminders', ['training_record_id', 'valid_until'], { unique: true, name: 'refresher_reminders_record_valid_until' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('refresher_reminders');
  await qi.dropTable('jobs');
  await qi.removeColumn('cohorts', 'refresher_lead_days');
};
