import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * A saved comparison's runs fingerprint (sha256 of each frozen run's id and last change), so its page
 * tells "changed since frozen" from a primary-key read of the runs and rebuilds the data tables only
 * when a run changed. Null for comparisons frozen before: they are checked the long way and given one.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('saved_comparisons', 'runs_fingerprint', { type: DataTypes.CHAR(64), allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('saved_comparisons', 'runs_fingerprint');
};
