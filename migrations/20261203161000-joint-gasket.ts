import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Structured gasket and flange data on the joint: contact diameters (or the contact area), the
 * gasket's minimum seating and maximum stress with the source the centre gives for them, the
 * flange facing and the clamped length. All optional: joints saved before have none of it.
 */
const COLUMNS = {
  gasket_inner_mm: { type: DataTypes.DOUBLE, allowNull: true },
  gasket_outer_mm: { type: DataTypes.DOUBLE, allowNull: true },
  gasket_area_mm2: { type: DataTypes.DOUBLE, allowNull: true },
  gasket_min_seating_mpa: { type: DataTypes.DOUBLE, allowNull: true },
  gasket_max_mpa: { type: DataTypes.DOUBLE, allowNull: true },
  gasket_stress_source: { type: DataTypes.STRING(200), allowNull: true },
  flange_facing: { type: DataTypes.STRING(40), allowNull: true },
  clamp_length_mm: { type: DataTypes.DOUBLE, allowNull: true },
} as const;

export const up: Migration = async ({ context: qi }) => {
  for (const [name, spec] of Object.entries(COLUMNS)) await qi.addColumn('joints', name, spec);
};

export const down: Migration = async ({ context: qi }) => {
  for (const name of Object.keys(COLUMNS).reverse()) await qi.removeColumn('joints', name);
};
