import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';

/** A frozen comparison: its query, runs, results as shown, software version and data hash (never recomputed). */
export class SavedComparison extends Model<InferAttributes<SavedComparison>, InferCreationAttributes<SavedComparison>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare title: string;
  declare createdById: number;
  declare queryJson: string;
  declare runIdsJson: string;
  declare resultsJson: string;
  declare softwareVersion: string;
  declare dataSha256: string;
  /** sha256 of the frozen runs' ids and last changes when the data was last found unchanged (`runsFingerprint`); null: not yet known. */
  declare runsFingerprint: CreationOptional<string | null>;
  /** The layout of its data tables (lib/saved-comparisons/data-tables.ts `PackageLayout`): 1 without gasket columns, 2 with. */
  declare packageLayout: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare createdBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    SavedComparison.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        slug: { type: DataTypes.CHAR(12), allowNull: false, unique: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
        createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        queryJson: { type: DataTypes.TEXT, allowNull: false },
        runIdsJson: { type: DataTypes.TEXT('medium'), allowNull: false },
        resultsJson: { type: DataTypes.TEXT('long'), allowNull: false },
        softwareVersion: { type: DataTypes.STRING(80), allowNull: false },
        dataSha256: { type: DataTypes.CHAR(64), allowNull: false },
        runsFingerprint: { type: DataTypes.CHAR(64), allowNull: true },
        packageLayout: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'saved_comparisons', underscored: true, timestamps: true, updatedAt: false },
    );
  }
}
