import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * One-time tokens for invitation and password-reset links. Only the SHA-256 of the token is
 * stored, so a copy of the table does not let anyone use a link.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('one_time_tokens', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    token_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    purpose: { type: DataTypes.ENUM('invite', 'reset'), allowNull: false },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'cohorts', key: 'id' }, onDelete: 'SET NULL' },
    created_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('one_time_tokens', ['token_sha256'], { name: 'one_time_tokens_hash', unique: true });
  await qi.addIndex('one_time_tokens', ['user_id', 'purpose'], { name: 'one_time_tokens_user_purpose' });
  await qi.addIndex('one_time_tokens', ['cohort_id'], { name: 'one_time_tokens_cohort' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('one_time_tokens');
};
