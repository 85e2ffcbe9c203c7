import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const TOKEN_PURPOSES = ['invite', 'reset'] as const;
export type TokenPurpose = (typeof TOKEN_PURPOSES)[number];

/** An invitation or password-reset link; only the SHA-256 of the token is stored. */
export class OneTimeToken extends Model<InferAttributes<OneTimeToken>, InferCreationAttributes<OneTimeToken>> {
  declare id: CreationOptional<number>;
  declare tokenSha256: string;
  declare purpose: TokenPurpose;
  declare userId: number;
  declare cohortId: number | null;
  declare createdById: number | null;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OneTimeToken.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        tokenSha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        purpose: { type: DataTypes.ENUM(...TOKEN_PURPOSES), allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'one_time_tokens', underscored: true, updatedAt: false },
    );
  }
}
