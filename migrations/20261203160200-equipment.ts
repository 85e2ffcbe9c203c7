import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * The equipment register (admin): torque wrenches, tensioner pumps and their gauges, load cells
 * and loggers, each with its calibration certificate and due date; `run_tools` records the tools a
 * run was made with.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('equipment', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.ENUM('torque_wrench', 'tensioner_pump', 'pump_gauge', 'load_cell', 'logger'), allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false },
    serial_number: { type: DataTypes.STRING(80), allowNull: false },
    certificate: { type: DataTypes.STRING(80), allowNull: true },
    calibrated_on: { type: DataTypes.DATEONLY, allowNull: true },
    due_on: { type: DataTypes.DATEONLY, allowNull: true },
    in_service: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('equipment', ['kind', 'serial_number'], { unique: true, name: 'equipment_kind_serial' });
  await qi.createTable('run_tools', {
    run_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    equipment_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, references: { model: 'equipment', key: 'id' } },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('run_tools');
  await qi.dropTable('equipment');
};
