import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A set of studs, nuts and washers used run after run (`hardware_sets`). */
export class HardwareSet extends Model<InferAttributes<HardwareSet>, InferCreationAttributes<HardwareSet>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare description: CreationOptional<string | null>;
  /** Runs recorded on this set so far (raised by one in each run's transaction). */
  declare useCount: CreationOptional<number>;
  declare conditionNotes: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    HardwareSet.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
        description: { type: DataTypes.STRING(240), allowNull: true },
        useCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        conditionNotes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'hardware_sets', underscored: true },
    );
  }
}
