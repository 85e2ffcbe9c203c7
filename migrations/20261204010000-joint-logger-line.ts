import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * The joint's logger line format for live capture in the browser (lib/ingest/logger-line.ts): serial
 * speed, field delimiter, decimal comma, which field is the time, which fields are channels 1, 2, …
 * (comma-separated field numbers; null = every other field in order) and the load unit. Existing
 * joints get the training defaults.
 */
const COLUMNS = {
  serial_baud_rate: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 9600 },
  line_delimiter: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'comma' },
  line_decimal_comma: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  line_time_field: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 },
  line_channel_fields: { type: DataTypes.STRING(2000), allowNull: true },
  line_load_unit: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'kN' },
} as const;

export const up: Migration = async ({ context: qi }) => {
  for (const [name, spec] of Object.entries(COLUMNS)) await qi.addColumn('joints', name, spec);
};

export const down: Migration = async ({ context: qi }) => {
  for (const name of Object.keys(COLUMNS).reverse()) await qi.removeColumn('joints', name);
};
