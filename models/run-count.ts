import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * How many runs one operator has in one cohort (0 = none) with one status and source, spread over
 * 8 slots (`run_counts`). Written only by the triggers on `runs` and `cohorts`
 * (migration 20261204080000-run-counts); read by the runs list for its total.
 */
export class RunCount extends Model<InferAttributes<RunCount>, InferCreationAttributes<RunCount>> {
  declare operatorId: number;
  declare cohortId: number;
  declare status: string;
  declare source: string;
  declare slot: number;
  declare n: number;

  static initModel(sequelize: Sequelize) {
    RunCount.init(
      {
        operatorId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        status: { type: DataTypes.STRING(16), primaryKey: true },
        source: { type: DataTypes.STRING(16), primaryKey: true },
        slot: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
        n: { type: DataTypes.INTEGER, allowNull: false },
      },
      { sequelize, tableName: 'run_counts', underscored: true, timestamps: false },
    );
  }
}
