import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A remembered column mapping for one joint and header signature (sha256 of the trimmed header names). */
export class ColumnMap extends Model<InferAttributes<ColumnMap>, InferCreationAttributes<ColumnMap>> {
  declare id: CreationOptional<number>;
  declare jointId: number;
  declare headerSignature: string;
  /** The header names as a JSON array. */
  declare headers: string;
  declare mapping: unknown;
  declare savedById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ColumnMap.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        jointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        headerSignature: { type: DataTypes.CHAR(64), allowNull: false },
        headers: { type: DataTypes.TEXT, allowNull: false },
        mapping: { type: DataTypes.JSON, allowNull: false },
        savedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'column_maps', underscored: true },
    );
  }
}
