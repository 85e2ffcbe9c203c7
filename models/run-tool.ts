import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A tool or instrument a run was made with. */
export class RunTool extends Model<InferAttributes<RunTool>, InferCreationAttributes<RunTool>> {
  declare runId: number;
  declare equipmentId: number;

  static initModel(sequelize: Sequelize) {
    RunTool.init(
      {
        runId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        equipmentId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      },
      { sequelize, tableName: 'run_tools', underscored: true, timestamps: false },
    );
  }
}
