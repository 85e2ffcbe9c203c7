import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Each run's analysis (what GET /api/runs/:id/analysis answers), computed when the run is stored
 * or its readings are corrected, with the ETag it is served under. A table of its own keeps the
 * runs rows narrow for the runs list; a run without a row here is analysed on its first request.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('run_analyses', {
    run_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    etag: { type: DataTypes.STRING(64), allowNull: false },
    body_json: { type: DataTypes.TEXT('long'), allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('run_analyses');
};
