import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Issue 17, course outcomes and records of training: the cohort's validity (months, 36 by default),
 * the decision per trainee (`course_outcomes`, one row per cohort and trainee) and the records of
 * training issued on a pass (`training_records`, each with its own verification code).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('cohorts', 'record_validity_months', { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 36 });
  await qi.createTable('course_outcomes', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'cohorts', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    decision: { type: DataTypes.STRING(8), allowNull: false },
    scopes: { type: DataTypes.TEXT, allowNull: false },
    decided_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    decided_by_name: { type: DataTypes.STRING(160), allowNull: false },
    decided_at: { type: DataTypes.DATE, allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
  });
  await qi.addIndex('course_outcomes', ['cohort_id', 'user_id'], { unique: true, name: 'course_outcomes_cohort_user' });
  await qi.createTable('training_records', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    code: { type: DataTypes.CHAR(16), allowNull: false, unique: true },
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'cohorts', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    trainee_name: { type: DataTypes.STRING(160), allowNull: false },
    course_name: { type: DataTypes.STRING(160), allowNull: false },
    scope: { type: DataTypes.STRING(400), allowNull: false },
    issued_on: { type: DataTypes.DATEONLY, allowNull: false },
    valid_until: { type: DataTypes.DATEONLY, allowNull: false },
    issued_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    issued_by_name: { type: DataTypes.STRING(160), allowNull: false },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    revoke_reason: { type: DataTypes.STRING(400), allowNull: true },
    replaced_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('training_records', ['cohort_id', 'user_id'], { name: 'training_records_cohort_user' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('training_records');
  await qi.dropTable('course_outcomes');
  await qi.removeColumn('cohorts', 'record_validity_months');
};
