import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One stud a multi-stud (tensioner) step covered, with the applied and residual load in N (`step_positions`). */
export class StepPosition extends Model<InferAttributes<StepPosition>, InferCreationAttributes<StepPosition>> {
  declare stepId: number;
  declare position: number;
  declare runId: number;
  /** The tool's peak load on the stud while pressurised. */
  declare appliedN: number;
  /** The load the stud kept after the tool was released. */
  declare residualN: number;

  static initModel(sequelize: Sequelize) {
    StepPosition.init(
      {
        stepId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        appliedN: { type: DataTypes.DOUBLE, allowNull: false },
        residualN: { type: DataTypes.DOUBLE, allowNull: false },
      },
      { sequelize, tableName: 'step_positions', underscored: true, timestamps: false },
    );
  }
}
