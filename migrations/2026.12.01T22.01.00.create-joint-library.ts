import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('joints', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    nominal_size: { type: DataTypes.STRING(40), allowNull: false },
    pressure_class: { type: DataTypes.STRING(40), allowNull: false },
    stud_count: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    thread_system: { type: DataTypes.ENUM('inch', 'metric'), allowNull: false },
    // inch: diameter in inches and threads per inch; metric: diameter and pitch in millimetres
    thread_diameter: { type: DataTypes.DOUBLE, allowNull: false },
    thread_pitch: { type: DataTypes.DOUBLE, allowNull: false },
    stud_grade: { type: DataTypes.STRING(80), allowNull: false },
    nut_grade: { type: DataTypes.STRING(80), allowNull: true },
    washer: { type: DataTypes.STRING(120), allowNull: true },
    gasket_type: { type: DataTypes.STRING(160), allowNull: false },
    target_load_n: { type: DataTypes.DOUBLE, allowNull: false },
    band_percent: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 10 },
    notes: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });

  await qi.createTable('joint_positions', {
    joint_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'joints', key: 'id' },
      onDelete: 'CASCADE',
    },
    position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    calibration_factor: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
    note: { type: DataTypes.STRING(240), allowNull: true },
  });

  await qi.createTable('methods', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false, unique: true },
    tool_kind: {
      type: DataTypes.ENUM('manual_torque_wrench', 'hydraulic_torque_wrench', 'hydraulic_tensioner', 'other'),
      allowNull: false,
    },
    // [{ percentOfTarget: 30, order: [1,5,3,7,...] }, ...] validated with zod at the boundary
    passes: { type: DataTypes.JSON, allowNull: false },
    check_passes: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 0 },
    notes: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });

  await qi.createTable('lubricants', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false, unique: true },
    nominal_nut_factor: { type: DataTypes.DOUBLE, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('lubricants');
  await qi.dropTable('methods');
  await qi.dropTable('joint_positions');
  await qi.dropTable('joints');
};
