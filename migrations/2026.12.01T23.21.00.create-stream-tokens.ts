import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Live stream: per-joint bridge tokens (only their sha256 is kept) and the raw samples a bridge
 * posts. Samples are keyed by (run, time, position) so a batch sent twice (a retry) writes nothing
 * new; steps are derived from them when the run is finished. All stream state lives here, so any
 * app instance may receive any batch.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('stream_tokens', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    joint_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'joints', key: 'id' }, onDelete: 'CASCADE' },
    token_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    label: { type: DataTypes.STRING(120), allowNull: false },
    created_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    last_used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('stream_tokens', ['token_sha256'], { name: 'stream_tokens_sha256', unique: true });
  await qi.addIndex('stream_tokens', ['joint_id'], { name: 'stream_tokens_joint' });

  await qi.createTable('stream_samples', {
    run_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    time_s: { type: DataTypes.DOUBLE, primaryKey: true },
    position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    load_n: { type: DataTypes.DOUBLE, allowNull: false },
    received_at: { type: DataTypes.DATE(3), allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('stream_samples');
  await qi.dropTable('stream_tokens');
};
