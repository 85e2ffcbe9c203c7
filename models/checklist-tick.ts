import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Whether one checklist item was observed for one trainee (`checklist_ticks`), by whom, when, with an optional note; un-ticking keeps the row. */
export class ChecklistTick extends Model<InferAttributes<ChecklistTick>, InferCreationAttributes<ChecklistTick>> {
  declare id: CreationOptional<number>;
  declare itemId: number;
  declare userId: number;
  declare observed: boolean;
  declare observedById: number;
  declare observedByName: string;
  declare observedAt: Date;
  declare note: string | null;
  /** Optimistic lock: raised by one on every save (lib/data/optimistic-lock.ts). */
  declare version: CreationOptional<number>;

  static initModel(sequelize: Sequelize) {
    ChecklistTick.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        itemId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        observed: { type: DataTypes.BOOLEAN, allowNull: false },
        observedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        observedByName: { type: DataTypes.STRING(160), allowNull: false },
        observedAt: { type: DataTypes.DATE, allowNull: false },
        note: { type: DataTypes.STRING(400), allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
      },
      { sequelize, tableName: 'checklist_ticks', underscored: true, timestamps: false },
    );
  }
}
