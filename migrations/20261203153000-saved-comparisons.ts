import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Saved (frozen) comparisons: the query as chosen, the ids of the runs it used, the results as
 * shown (JSON), the software version and a sha256 of the data tables, so a comparison can be cited
 * and its numbers reproduced later from the same runs.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('saved_comparisons', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    slug: { type: DataTypes.CHAR(12), allowNull: false, unique: true },
    title: { type: DataTypes.STRING(200), allowNull: false },
    created_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    query_json: { type: DataTypes.TEXT, allowNull: false },
    run_ids_json: { type: DataTypes.TEXT('medium'), allowNull: false },
    results_json: { type: DataTypes.TEXT('long'), allowNull: false },
    software_version: { type: DataTypes.STRING(80), allowNull: false },
    data_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('saved_comparisons', ['created_by_id', 'created_at'], { name: 'saved_comparisons_author' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('saved_comparisons');
};
