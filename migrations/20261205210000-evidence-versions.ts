import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

const TABLES = ['theory_results', 'checklist_ticks'] as const;

/**
 * Optimistic locking for a trainee's theory result and checklist ticks, as for the course outcome:
 * each row carries a version the sheet's form sends back; a save from a form opened before someone
 * else's save changes nothing. Existing rows start at 1 (the column's default), so a form opened
 * before a row existed (version 0) cannot overwrite it.
 */
export const up: Migration = async ({ context: qi }) => {
  for (const table of TABLES) await qi.addColumn(table, 'version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 });
};

export const down: Migration = async ({ context: qi }) => {
  for (const table of TABLES) await qi.removeColumn(table, 'version');
};
