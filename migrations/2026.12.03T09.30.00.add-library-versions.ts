import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Optimistic locking for the library and the cohort criteria: each row carries a version that an
 * edit form sends back; a save whose version is no longer current changes nothing.
 */
const TABLES = ['joints', 'methods', 'lubricants', 'cohort_criteria'] as const;

export const up: Migration = async ({ context: qi }) => {
  for (const table of TABLES) await qi.addColumn(table, 'version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
};

export const down: Migration = async ({ context: qi }) => {
  for (const table of TABLES) await qi.removeColumn(table, 'version');
};
