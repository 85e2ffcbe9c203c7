import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One lot (batch) of a lubricant (`lubricant_lots`). */
export class LubricantLot extends Model<InferAttributes<LubricantLot>, InferCreationAttributes<LubricantLot>> {
  declare id: CreationOptional<number>;
  declare lubricantId: number;
  declare lotCode: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    LubricantLot.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        lubricantId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        lotCode: { type: DataTypes.STRING(60), allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'lubricant_lots', underscored: true, indexes: [{ unique: true, fields: ['lubricant_id', 'lot_code'], name: 'lubricant_lots_lubricant_lot' }] },
    );
  }
}
