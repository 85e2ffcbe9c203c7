import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The course decision for one trainee in one cohort (`course_outcomes`): pass or not yet, scopes as JSON, who decided. */
export class CourseOutcome extends Model<InferAttributes<CourseOutcome>, InferCreationAttributes<CourseOutcome>> {
  declare id: CreationOptional<number>;
  declare cohortId: number;
  declare userId: number;
  declare decision: string;
  declare scopes: string;
  declare decidedById: number;
  declare decidedByName: string;
  declare decidedAt: Date;
  declare version: CreationOptional<number>;
  /** Why a pass was recorded with something outstanding (null when nothing was). */
  declare overrideReason: CreationOptional<string | null>;

  static initModel(sequelize: Sequelize) {
    CourseOutcome.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        decision: { type: DataTypes.STRING(8), allowNull: false },
        scopes: { type: DataTypes.TEXT, allowNull: false },
        decidedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        decidedByName: { type: DataTypes.STRING(160), allowNull: false },
        decidedAt: { type: DataTypes.DATE, allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        overrideReason: { type: DataTypes.STRING(400), allowNull: true },
      },
      { sequelize, tableName: 'course_outcomes', underscored: true, timestamps: false },
    );
  }
}
