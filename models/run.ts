import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const RUN_SOURCES = ['upload', 'manual', 'simulated', 'live'] as const;
export type RunSource = (typeof RUN_SOURCES)[number];
export const RUN_STATUSES = ['draft', 'recording', 'complete', 'set_aside'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: CreationOptional<number>;
  declare jointId: number;
  declare methodId: number;
  declare lubricantId: number;
  declare operatorId: number;
  declare cohortId: number | null;
  declare targetLoadN: number;
  declare bandPercent: CreationOptional<number>;
  declare source: RunSource;
  declare status: RunStatus;
  declare setAsideReason: CreationOptional<string | null>;
  declare setAsideById: CreationOptional<number | null>;
  declare recordedAt: Date;
  declare notes: CreationOptional<string | null>;
  declare studCount: number;
  declare stepCount: CreationOptional<number>;
  declare passCount: CreationOptional<number>;
  declare finalMeanN: CreationOptional<number | null>;
  declare finalSdN: CreationOptional<number | null>;
  declare finalCv: CreationOptional<number | null>;
  declare finalMinN: CreationOptional<number | null>;
  declare finalMaxN: CreationOptional<number | null>;
  /** JSON array of the final loads in N (index 0 = position 1). */
  declare finalLoadsJson: CreationOptional<string | null>;
  /** JSON array of each stud's drift in % since it was last tightened. */
  declare driftJson: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  /** The joint as it stood when the run was recorded. */
  declare jointVersionId: CreationOptional<number | null>;
  /** The joint's calibration in force when the run was recorded (null: none recorded). */
  declare calibrationSessionId: CreationOptional<number | null>;

  static initModel(sequelize: Sequelize) {
    Run.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        jointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        methodId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        lubricantId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        operatorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        targetLoadN: { type: DataTypes.DOUBLE, allowNull: false },
        bandPercent: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 10 },
        source: { type: DataTypes.ENUM(...RUN_SOURCES), allowNull: false },
        status: { type: DataTypes.ENUM(...RUN_STATUSES), allowNull: false },
        setAsideReason: { type: DataTypes.STRING(400), allowNull: true },
        setAsideById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        recordedAt: { type: DataTypes.DATE, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: true },
        studCount: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        stepCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        passCount: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        finalMeanN: { type: DataTypes.DOUBLE, allowNull: true },
        finalSdN: { type: DataTypes.DOUBLE, allowNull: true },
        finalCv: { type: DataTypes.DOUBLE, allowNull: true },
        finalMinN: { type: DataTypes.DOUBLE, allowNull: true },
        finalMaxN: { type: DataTypes.DOUBLE, allowNull: true },
        finalLoadsJson: { type: DataTypes.TEXT, allowNull: true },
        driftJson: { type: DataTypes.TEXT, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
        jointVersionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        calibrationSessionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      { sequelize, tableName: 'runs', underscored: true },
    );
  }
}
