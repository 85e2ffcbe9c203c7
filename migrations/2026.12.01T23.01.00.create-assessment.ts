import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/** A cohort's acceptance criteria, and the signed verdict on each judged run. */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('cohort_criteria', {
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'cohorts', key: 'id' }, onDelete: 'CASCADE' },
    band_percent: { type: DataTypes.DOUBLE, allowNull: false },
    max_cv_percent: { type: DataTypes.DOUBLE, allowNull: false },
    require_pattern: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    max_yield_percent: { type: DataTypes.DOUBLE, allowNull: false },
    updated_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });

  await qi.createTable('run_verdicts', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'cohorts', key: 'id' }, onDelete: 'CASCADE' },
    // The criteria as they were when the run was judged, and the per-criterion results.
    criteria: { type: DataTypes.JSON, allowNull: false },
    results: { type: DataTypes.JSON, allowNull: false },
    all_met: { type: DataTypes.BOOLEAN, allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: true },
    signed_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    signed_at: { type: DataTypes.DATE, allowNull: false },
    results_sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('run_verdicts', ['run_id'], { name: 'run_verdicts_run', unique: true });
  await qi.addIndex('run_verdicts', ['cohort_id', 'signed_at'], { name: 'run_verdicts_cohort_signed' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('run_verdicts');
  await qi.dropTable('cohort_criteria');
};
