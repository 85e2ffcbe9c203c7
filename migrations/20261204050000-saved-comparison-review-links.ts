import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Review links of saved comparisons: an unguessable token (only its sha256 is kept) that opens one
 * saved comparison read-only without an account until it expires or is revoked.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('saved_comparison_review_links', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    saved_comparison_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'saved_comparisons', key: 'id' }, onDelete: 'CASCADE' },
    token_sha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    created_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
  });
  await qi.addIndex('saved_comparison_review_links', ['saved_comparison_id', 'created_at'], { name: 'review_links_comparison' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('saved_comparison_review_links');
};
