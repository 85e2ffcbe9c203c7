import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Hardware that wears: sets of studs, nuts and washers with a use count that rises with each run
 * recorded on them and condition notes; lubricant lots; and per run the set (with the use number it
 * had), the lubricant lot and whether the gasket was new or reused.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('hardware_sets', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
    description: { type: DataTypes.STRING(240), allowNull: true },
    use_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    condition_notes: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('lubricant_lots', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    lubricant_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'lubricants', key: 'id' }, onDelete: 'CASCADE' },
    lot_code: { type: DataTypes.STRING(60), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('lubricant_lots', ['lubricant_id', 'lot_code'], { unique: true, name: 'lubricant_lots_lubricant_lot' });
  await qi.addColumn('runs', 'hardware_set_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'hardware_sets', key: 'id' }, onDelete: 'SET NULL' });
  await qi.addColumn('runs', 'hardware_use_number', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true });
  await qi.addColumn('runs', 'lubricant_lot_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'lubricant_lots', key: 'id' }, onDelete: 'SET NULL' });
  await qi.addColumn('runs', 'gasket_condition', { type: DataTypes.ENUM('new', 'reused'), allowNull: true });
};

export const down: Migration = async ({ context: qi }) => {
  for (const column of ['gasket_condition', 'lubricant_lot_id', 'hardware_use_number', 'hardware_set_id']) await qi.removeColumn('runs', column);
  await qi.dropTable('lubricant_lots');
  await qi.dropTable('hardware_sets');
};
