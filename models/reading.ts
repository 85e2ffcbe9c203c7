import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One stud's load after one step, in newtons (units are converted only at the edges). */
export class Reading extends Model<InferAttributes<Reading>, InferCreationAttributes<Reading>> {
  declare stepId: number;
  declare position: number;
  declare runId: number;
  declare loadN: number;

  static initModel(sequelize: Sequelize) {
    Reading.init(
      {
        stepId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        loadN: { type: DataTypes.DOUBLE, allowNull: false },
      },
      { sequelize, tableName: 'readings', underscored: true, timestamps: false },
    );
  }
}
