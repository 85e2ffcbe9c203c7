import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';

/** One sign-in: its id rides in the session token; sign-out sets `revokedAt`, so a copied cookie is refused. */
export class UserSession extends Model<InferAttributes<UserSession>, InferCreationAttributes<UserSession>> {
  declare id: string;
  declare userId: number;
  declare createdAt: Date;
  declare lastSeenAt: Date;
  declare revokedAt: CreationOptional<Date | null>;
  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    UserSession.init(
      {
        id: { type: DataTypes.CHAR(32), primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        lastSeenAt: { type: DataTypes.DATE, allowNull: false },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'user_sessions', underscored: true, timestamps: false },
    );
  }
}
