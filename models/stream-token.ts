import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A live-stream bridge token for one joint; only its sha256 is stored. */
export class StreamToken extends Model<InferAttributes<StreamToken>, InferCreationAttributes<StreamToken>> {
  declare id: CreationOptional<number>;
  declare jointId: number;
  declare tokenSha256: string;
  declare label: string;
  declare createdById: number;
  declare revokedAt: CreationOptional<Date | null>;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    StreamToken.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        jointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tokenSha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        label: { type: DataTypes.STRING(120), allowNull: false },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        lastUsedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'stream_tokens', underscored: true, updatedAt: false },
    );
  }
}
