import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A computed comparison (JSON), valid while the fingerprint of the runs it was computed from is unchanged. */
export class ComparisonCache extends Model<InferAttributes<ComparisonCache>, InferCreationAttributes<ComparisonCache>> {
  declare cacheKey: string;
  declare fingerprint: string;
  declare body: string;
  declare createdAt: Date;

  static initModel(sequelize: Sequelize) {
    ComparisonCache.init(
      {
        cacheKey: { type: DataTypes.CHAR(64), primaryKey: true },
        fingerprint: { type: DataTypes.STRING(255), allowNull: false },
        body: { type: DataTypes.TEXT('long'), allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'comparison_cache', underscored: true, timestamps: false },
    );
  }
}
