import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * One of the 16 counters whose sum is the runs list's version stamp (`run_list_versions`). Written
 * only by the triggers of migration 20261205190000-run-list-versions; read by the runs list's memo
 * (`lib/data/run-list-memo.ts`).
 */
export class RunListVersion extends Model<InferAttributes<RunListVersion>, InferCreationAttributes<RunListVersion>> {
  declare slot: number;
  declare version: number;

  static initModel(sequelize: Sequelize) {
    RunListVersion.init(
      {
        slot: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
        version: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'run_list_versions', underscored: true, timestamps: false },
    );
  }
}
