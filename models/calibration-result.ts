import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One position's result in a calibration session. */
export class CalibrationResult extends Model<InferAttributes<CalibrationResult>, InferCreationAttributes<CalibrationResult>> {
  declare sessionId: number;
  declare position: number;
  declare factor: number;
  declare factorLower: number;
  declare factorUpper: number;
  declare linearityPercent: number;
  declare hysteresisPercent: number;
  declare zeroReturnPercent: number;
  declare accepted: boolean;
  declare refusals: string | null;
  declare drift: boolean;

  static initModel(sequelize: Sequelize) {
    CalibrationResult.init(
      {
        sessionId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        factor: { type: DataTypes.DOUBLE, allowNull: false },
        factorLower: { type: DataTypes.DOUBLE, allowNull: false },
        factorUpper: { type: DataTypes.DOUBLE, allowNull: false },
        linearityPercent: { type: DataTypes.DOUBLE, allowNull: false },
        hysteresisPercent: { type: DataTypes.DOUBLE, allowNull: false },
        zeroReturnPercent: { type: DataTypes.DOUBLE, allowNull: false },
        accepted: { type: DataTypes.BOOLEAN, allowNull: false },
        refusals: { type: DataTypes.STRING(400), allowNull: true },
        drift: { type: DataTypes.BOOLEAN, allowNull: false },
      },
      { sequelize, tableName: 'calibration_results', underscored: true, timestamps: false },
    );
  }
}
