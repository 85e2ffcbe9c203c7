import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { EQUIPMENT_KINDS, type EquipmentKind } from '../lib/equipment/equipment-kinds';

/** One tool or instrument of the equipment register, with its calibration and due date. */
export class Equipment extends Model<InferAttributes<Equipment>, InferCreationAttributes<Equipment>> {
  declare id: CreationOptional<number>;
  declare kind: EquipmentKind;
  declare name: string;
  declare serialNumber: string;
  declare certificate: string | null;
  declare calibratedOn: string | null;
  declare dueOn: string | null;
  declare inService: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Equipment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.ENUM(...EQUIPMENT_KINDS), allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        serialNumber: { type: DataTypes.STRING(80), allowNull: false },
        certificate: { type: DataTypes.STRING(80), allowNull: true },
        calibratedOn: { type: DataTypes.DATEONLY, allowNull: true },
        dueOn: { type: DataTypes.DATEONLY, allowNull: true },
        inService: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'equipment', underscored: true },
    );
  }
}
