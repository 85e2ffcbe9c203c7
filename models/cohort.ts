import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { User } from './user';

export class Cohort extends Model<InferAttributes<Cohort>, InferCreationAttributes<Cohort>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare site: string;
  declare startsOn: string;
  declare endsOn: string;
  declare instructorId: ForeignKey<User['id']>;
  /** How long a record of training from this cohort is valid (36 months unless the centre sets its own). */
  declare recordValidityMonths: CreationOptional<number>;
  /** How many days before a record's valid-until date its refresher reminder goes out (90 unless the centre sets its own). */
  declare refresherLeadDays: CreationOptional<number>;
  /** Theory pass mark in percent; null = the training default (DEFAULT_THEORY_PASS_MARK). */
  declare theoryPassMark: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Cohort.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        site: { type: DataTypes.STRING(160), allowNull: false },
        startsOn: { type: DataTypes.DATEONLY, allowNull: false },
        endsOn: { type: DataTypes.DATEONLY, allowNull: false },
        instructorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        recordValidityMonths: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 36 },
        refresherLeadDays: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 90 },
        theoryPassMark: { type: DataTypes.TINYINT.UNSIGNED, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'cohorts', underscored: true },
    );
  }
}
