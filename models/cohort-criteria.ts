import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A cohort's acceptance criteria for a run (see lib/assessment/criteria.ts for defaults and limits). */
export class CohortCriteria extends Model<InferAttributes<CohortCriteria>, InferCreationAttributes<CohortCriteria>> {
  declare cohortId: number;
  declare bandPercent: number;
  declare maxCvPercent: number;
  declare requirePattern: boolean;
  declare maxYieldPercent: number;
  declare updatedById: number | null;
  /** Optimistic-lock version: raised by one on every edit (lib/data/optimistic-lock.ts). */
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CohortCriteria.init(
      {
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        bandPercent: { type: DataTypes.DOUBLE, allowNull: false },
        maxCvPercent: { type: DataTypes.DOUBLE, allowNull: false },
        requirePattern: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        maxYieldPercent: { type: DataTypes.DOUBLE, allowNull: false },
        updatedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'cohort_criteria', underscored: true },
    );
  }
}
