import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One person's remembered settings (Record's way in and header as JSON text), one row per user. */
export class UserPreference extends Model<InferAttributes<UserPreference>, InferCreationAttributes<UserPreference>> {
  declare userId: number;
  declare recordWayIn: string | null;
  declare recordHeader: string | null;
  declare updatedAt: Date;

  static initModel(sequelize: Sequelize) {
    UserPreference.init(
      {
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        recordWayIn: { type: DataTypes.STRING(16), allowNull: true },
        recordHeader: { type: DataTypes.TEXT, allowNull: true },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'user_preferences', underscored: true, timestamps: false },
    );
  }
}
