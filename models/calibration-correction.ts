import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A correction of a calibration session: who, why, the table before, how many runs it recomputed. */
export class CalibrationCorrection extends Model<InferAttributes<CalibrationCorrection>, InferCreationAttributes<CalibrationCorrection>> {
  declare id: CreationOptional<number>;
  declare sessionId: number;
  declare correctedById: number;
  declare reason: string;
  declare oldTableText: string;
  declare runsRecomputed: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CalibrationCorrection.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        sessionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        correctedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        reason: { type: DataTypes.STRING(400), allowNull: false },
        oldTableText: { type: DataTypes.TEXT, allowNull: false },
        runsRecomputed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'calibration_corrections', underscored: true, updatedAt: false },
    );
  }
}
