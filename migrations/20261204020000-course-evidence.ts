import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Issue 17 item 3, what stands behind a course outcome: the cohort's theory pass mark (null = the
 * training default), each trainee's theory result, the cohort's observation checklist (items kept by
 * id; a removed item is retired, never deleted, so its ticks stay) and the ticks per trainee (one row
 * per item and trainee; un-ticking keeps the row), and the override reason of a pass decided with
 * something outstanding.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('cohorts', 'theory_pass_mark', { type: DataTypes.TINYINT.UNSIGNED, allowNull: true });
  await qi.addColumn('course_outcomes', 'override_reason', { type: DataTypes.STRING(400), allowNull: true });
  await qi.createTable('theory_results', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'cohorts', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    score_percent: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
    taken_on: { type: DataTypes.DATEONLY, allowNull: false },
    entered_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    entered_by_name: { type: DataTypes.STRING(160), allowNull: false },
    entered_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('theory_results', ['cohort_id', 'user_id'], { unique: true, name: 'theory_results_cohort_user' });
  await qi.createTable('checklist_items', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'cohorts', key: 'id' }, onDelete: 'CASCADE' },
    label: { type: DataTypes.STRING(120), allowNull: false },
    position: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    retired_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('checklist_items', ['cohort_id'], { name: 'checklist_items_cohort' });
  await qi.createTable('checklist_ticks', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    item_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'checklist_items', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    observed: { type: DataTypes.BOOLEAN, allowNull: false },
    observed_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    observed_by_name: { type: DataTypes.STRING(160), allowNull: false },
    observed_at: { type: DataTypes.DATE, allowNull: false },
    note: { type: DataTypes.STRING(400), allowNull: true },
  });
  await qi.addIndex('checklist_ticks', ['item_id', 'user_id'], { unique: true, name: 'checklist_ticks_item_user' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('checklist_ticks');
  await qi.dropTable('checklist_items');
  await qi.dropTable('theory_results');
  await qi.removeColumn('course_outcomes', 'override_reason');
  await qi.removeColumn('cohorts', 'theory_pass_mark');
};
