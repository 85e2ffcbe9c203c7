import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Sessions that can end: a per-person `session_version` (raised by a role change, a deactivation, a
 * password reset or "sign out everywhere"; a token carrying an older version is refused) and one row
 * per sign-in (`user_sessions`), revoked on sign-out so a copied cookie stops working. The state is
 * here, not in any instance, so every instance behind a balancer sees the same answer.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn('users', 'session_version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
  await qi.createTable('user_sessions', {
    id: { type: DataTypes.CHAR(32), primaryKey: true },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    created_at: { type: DataTypes.DATE, allowNull: false },
    last_seen_at: { type: DataTypes.DATE, allowNull: false },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
  });
  await qi.addIndex('user_sessions', ['user_id', 'created_at'], { name: 'user_sessions_user' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('user_sessions');
  await qi.removeColumn('users', 'session_version');
};
