import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Remembered column mappings: one per joint and header signature (the sha256 of the file's
 * trimmed header names, in order), so the next file from the same logger needs one click.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('column_maps', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    joint_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'joints', key: 'id' }, onDelete: 'CASCADE' },
    header_signature: { type: DataTypes.CHAR(64), allowNull: false },
    headers: { type: DataTypes.TEXT, allowNull: false },
    mapping: { type: DataTypes.JSON, allowNull: false },
    saved_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('column_maps', ['joint_id', 'header_signature'], { name: 'column_maps_joint_signature', unique: true });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('column_maps');
};
