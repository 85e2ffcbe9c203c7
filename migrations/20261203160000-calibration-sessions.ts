import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Gauge calibration against the reference load cell: the centre's acceptance limits (one row;
 * none means the training defaults), a session per joint (the load cell's certificate, the table as
 * entered, the next due date) and one result row per position (factor with its 95 % interval,
 * linearity, hysteresis, zero return, verdict, drift flag).
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('calibration_limits', {
    id: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
    linearity_percent: { type: DataTypes.DOUBLE, allowNull: false },
    hysteresis_percent: { type: DataTypes.DOUBLE, allowNull: false },
    zero_return_percent: { type: DataTypes.DOUBLE, allowNull: false },
    interval_percent: { type: DataTypes.DOUBLE, allowNull: false },
    interval_months: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    updated_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('calibration_sessions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    joint_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'joints', key: 'id' }, onDelete: 'CASCADE' },
    performed_on: { type: DataTypes.DATEONLY, allowNull: false },
    due_on: { type: DataTypes.DATEONLY, allowNull: false },
    load_cell_certificate: { type: DataTypes.STRING(80), allowNull: false },
    load_cell_certified_on: { type: DataTypes.DATEONLY, allowNull: false },
    load_cell_due_on: { type: DataTypes.DATEONLY, allowNull: false },
    table_text: { type: DataTypes.TEXT, allowNull: false },
    full_scale_kn: { type: DataTypes.DOUBLE, allowNull: false },
    accepted: { type: DataTypes.BOOLEAN, allowNull: false },
    recorded_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('calibration_sessions', ['joint_id', 'performed_on'], { name: 'calibration_sessions_joint_date' });
  await qi.createTable('calibration_results', {
    session_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'calibration_sessions', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    factor: { type: DataTypes.DOUBLE, allowNull: false },
    factor_lower: { type: DataTypes.DOUBLE, allowNull: false },
    factor_upper: { type: DataTypes.DOUBLE, allowNull: false },
    linearity_percent: { type: DataTypes.DOUBLE, allowNull: false },
    hysteresis_percent: { type: DataTypes.DOUBLE, allowNull: false },
    zero_return_percent: { type: DataTypes.DOUBLE, allowNull: false },
    accepted: { type: DataTypes.BOOLEAN, allowNull: false },
    refusals: { type: DataTypes.STRING(400), allowNull: true },
    drift: { type: DataTypes.BOOLEAN, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('calibration_results');
  await qi.dropTable('calibration_sessions');
  await qi.dropTable('calibration_limits');
};
