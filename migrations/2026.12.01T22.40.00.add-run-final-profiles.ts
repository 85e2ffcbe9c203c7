import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

// Per-run profiles stored when a run is saved (recomputed when it changes), so a comparison across
// thousands of runs reads one row per run instead of every reading.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('runs', 'final_loads_json', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('runs', 'drift_json', { type: DataTypes.TEXT, allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('runs', 'drift_json');
  await qi.removeColumn('runs', 'final_loads_json');
};
