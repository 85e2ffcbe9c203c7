import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The centre's limits for accepting a gauge calibration: one row (id 1); none = the training defaults. */
export class CalibrationLimit extends Model<InferAttributes<CalibrationLimit>, InferCreationAttributes<CalibrationLimit>> {
  declare id: number;
  declare linearityPercent: number;
  declare hysteresisPercent: number;
  declare zeroReturnPercent: number;
  declare intervalPercent: number;
  declare intervalMonths: number;
  declare updatedById: number;
  declare updatedAt: Date;

  static initModel(sequelize: Sequelize) {
    CalibrationLimit.init(
      {
        id: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
        linearityPercent: { type: DataTypes.DOUBLE, allowNull: false },
        hysteresisPercent: { type: DataTypes.DOUBLE, allowNull: false },
        zeroReturnPercent: { type: DataTypes.DOUBLE, allowNull: false },
        intervalPercent: { type: DataTypes.DOUBLE, allowNull: false },
        intervalMonths: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        updatedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'calibration_limits', underscored: true, createdAt: false },
    );
  }
}
