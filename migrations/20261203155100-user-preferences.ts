import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/** Per-person settings that follow the person from browser to browser: for now what Record remembers (way in, header). */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('user_preferences', {
    user_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    record_way_in: { type: DataTypes.STRING(16), allowNull: true },
    record_header: { type: DataTypes.TEXT, allowNull: true },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('user_preferences');
};
