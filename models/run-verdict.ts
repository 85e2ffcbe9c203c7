import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { AssessmentCriteria } from '@/lib/assessment/criteria';
import type { CriterionResult } from '@/lib/assessment/judge-run';

const json = <T>(field: string) => ({
  type: DataTypes.JSON,
  allowNull: false,
  // MariaDB stores JSON as LONGTEXT: parse on read.
  get(this: Model) {
    const raw = this.getDataValue(field) as unknown;
    return (typeof raw === 'string' ? JSON.parse(raw) : raw) as T;
  },
});

/** The signed judgement of one run against its cohort's criteria (a snapshot of both). */
export class RunVerdict extends Model<InferAttributes<RunVerdict>, InferCreationAttributes<RunVerdict>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare cohortId: number;
  declare criteria: AssessmentCriteria;
  declare results: CriterionResult[];
  declare allMet: boolean;
  declare comment: string | null;
  declare signedById: number;
  declare signedAt: Date;
  declare resultsSentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RunVerdict.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        criteria: json<AssessmentCriteria>('criteria'),
        results: json<CriterionResult[]>('results'),
        allMet: { type: DataTypes.BOOLEAN, allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: true },
        signedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        signedAt: { type: DataTypes.DATE, allowNull: false },
        resultsSentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'run_verdicts', underscored: true },
    );
  }
}
