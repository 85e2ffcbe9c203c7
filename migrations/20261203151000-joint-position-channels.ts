import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * The joint's channel map: the logger channel wired to each position (`CH3`, `AI2`, a gauge's
 * serial name), on the position's row. Null = the default, channel k is position k (AI0 position 1).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('joint_positions', 'channel', { type: DataTypes.STRING(60), allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeColumn('joint_positions', 'channel');
};
