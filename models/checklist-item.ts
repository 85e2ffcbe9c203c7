import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One item of a cohort's observation checklist (`checklist_items`); a removed item is retired (`retiredAt`), never deleted. */
export class ChecklistItem extends Model<InferAttributes<ChecklistItem>, InferCreationAttributes<ChecklistItem>> {
  declare id: CreationOptional<number>;
  declare cohortId: number;
  declare label: string;
  declare position: number;
  declare retiredAt: Date | null;
  declare createdAt: Date;

  static initModel(sequelize: Sequelize) {
    ChecklistItem.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        label: { type: DataTypes.STRING(120), allowNull: false },
        position: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        retiredAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'checklist_items', underscored: true, timestamps: false },
    );
  }
}
