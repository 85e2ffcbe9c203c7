import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A run's figures before and after a recompute (a corrected calibration). */
export class RunFigureHistory extends Model<InferAttributes<RunFigureHistory>, InferCreationAttributes<RunFigureHistory>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare correctionId: number;
  declare oldFigures: Record<string, unknown>;
  declare newFigures: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RunFigureHistory.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        correctionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        oldFigures: { type: DataTypes.JSON, allowNull: false },
        newFigures: { type: DataTypes.JSON, allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'run_figure_history', underscored: true, updatedAt: false },
    );
  }
}
