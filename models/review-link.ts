import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A reviewer's link to one saved comparison: the token's sha256 (never the token), its expiry and revocation. */
export class ReviewLink extends Model<InferAttributes<ReviewLink>, InferCreationAttributes<ReviewLink>> {
  declare id: CreationOptional<number>;
  declare savedComparisonId: number;
  declare tokenSha256: string;
  declare createdById: number;
  declare createdAt: Date;
  declare expiresAt: Date;
  declare revokedAt: Date | null;

  static initModel(sequelize: Sequelize) {
    ReviewLink.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        savedComparisonId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tokenSha256: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'saved_comparison_review_links', underscored: true, timestamps: false },
    );
  }
}
