import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

// Computed comparisons, kept in MariaDB (not in a server process) so every app instance shares them.
// A row is valid while the fingerprint of the runs it was computed from is unchanged.
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('comparison_cache', {
    cache_key: { type: DataTypes.CHAR(64), primaryKey: true },
    fingerprint: { type: DataTypes.STRING(255), allowNull: false },
    body: { type: DataTypes.TEXT('long'), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('comparison_cache', ['created_at'], { name: 'comparison_cache_created' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('comparison_cache');
};
