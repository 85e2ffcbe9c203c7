import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One calibration of a joint's gauges against the reference load cell (the table as entered, the certificate, the due date). */
export class CalibrationSession extends Model<InferAttributes<CalibrationSession>, InferCreationAttributes<CalibrationSession>> {
  declare id: CreationOptional<number>;
  declare jointId: number;
  declare performedOn: string;
  declare dueOn: string;
  declare loadCellCertificate: string;
  declare loadCellCertifiedOn: string;
  declare loadCellDueOn: string;
  declare tableText: string;
  declare fullScaleKn: number;
  declare accepted: boolean;
  declare recordedById: number;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CalibrationSession.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        jointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        performedOn: { type: DataTypes.DATEONLY, allowNull: false },
        dueOn: { type: DataTypes.DATEONLY, allowNull: false },
        loadCellCertificate: { type: DataTypes.STRING(80), allowNull: false },
        loadCellCertifiedOn: { type: DataTypes.DATEONLY, allowNull: false },
        loadCellDueOn: { type: DataTypes.DATEONLY, allowNull: false },
        tableText: { type: DataTypes.TEXT, allowNull: false },
        fullScaleKn: { type: DataTypes.DOUBLE, allowNull: false },
        accepted: { type: DataTypes.BOOLEAN, allowNull: false },
        recordedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'calibration_sessions', underscored: true },
    );
  }
}
