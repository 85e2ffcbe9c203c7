import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class CohortMember extends Model<InferAttributes<CohortMember>, InferCreationAttributes<CohortMember>> {
  declare cohortId: number;
  declare userId: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CohortMember.init(
      {
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'cohort_members', underscored: true, updatedAt: false },
    );
  }
}
