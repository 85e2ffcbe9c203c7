import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One stud's load at one time of a hold after a pass (`run_holds`). */
export class RunHold extends Model<InferAttributes<RunHold>, InferCreationAttributes<RunHold>> {
  declare runId: number;
  /** The pass the hold follows. */
  declare afterPass: number;
  /** Seconds since the end of that pass. */
  declare elapsedS: number;
  declare position: number;
  declare loadN: number;

  static initModel(sequelize: Sequelize) {
    RunHold.init(
      {
        runId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        afterPass: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        elapsedS: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        loadN: { type: DataTypes.DOUBLE, allowNull: false },
      },
      { sequelize, tableName: 'run_holds', underscored: true, timestamps: false },
    );
  }
}
