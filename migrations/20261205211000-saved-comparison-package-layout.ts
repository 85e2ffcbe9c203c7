import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * The layout of a saved comparison's data tables (lib/saved-comparisons/data-tables.ts): 1 for
 * comparisons frozen before the runs table carried the gasket figures, 2 for those frozen since. The
 * package is built in the comparison's own layout, so its data still hashes to the frozen sha256.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('saved_comparisons', 'package_layout', { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('saved_comparisons', 'package_layout');
};
