import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const RUN_SOURCES = ['upload', 'manual', 'simulated', 'live'] as const;
export type RunSource = (typeof RUN_SOURCES)[number];
export const RUN_STATUSES = ['draft', 'recording', 'complete', 'set_aside', 'needs_review'] as const;
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
  /** Who put the run in (the way in is `source`); null only for rows older than the column. */
  declare recordedById: CreationOptional<number | null>;
  /** The cohort instructor (or admin) who confirmed a trainee-recorded run as a witnessed attempt. */
  declare assessedConfirmedById: CreationOptional<number | null>;
  declare assessedConfirmedAt: CreationOptional<Date | null>;
  /** Why the run check held the run (JSON list of lib/run-check reasons); null when it passed. */
  declare reviewReasons: CreationOptional<string | null>;
  declare reviewedById: CreationOptional<number | null>;
  declare reviewedAt: CreationOptional<Date | null>;
  declare reviewNote: CreationOptional<string | null>;
  /** sha256 of a simulated run's normalised header, gasket and seed (unique); null for other runs. */
  declare simulationKey: CreationOptional<string | null>;
  declare recordedAt: Date;
  declare notes: CreationOptional<string | null>;
  /** The studs/nuts/washers set used, and its use number on this run (1 = first run on the set). */
  declare hardwareSetId: CreationOptional<number | null>;
  declare hardwareUseNumber: CreationOptional<number | null>;
  declare lubricantLotId: CreationOptional<number | null>;
  declare gasketCondition: CreationOptional<'new' | 'reused' | null>;
  declare studCount: number;
  declare stepCount: CreationOptional<number>;
  declare passCount: CreationOptional<number>;
  declare finalMeanN: CreationOptional<number | null>;
  /** Average gasket stress after the final step, MPa, and the recorded joint's minimum seating stress (lib/record/run-gasket-figures.ts). */
  declare finalGasketStressMpa: CreationOptional<number | null>;
  declare gasketMinSeatingMpa: CreationOptional<number | null>;
  declare finalSdN: CreationOptional<number | null>;
  declare finalCv: CreationOptional<number | null>;
  declare finalMinN: CreationOptional<number | null>;
  declare finalMaxN: CreationOptional<number | null>;
  /** JSON array of the final loads in N (index 0 = position 1). */
  declare finalLoadsJson: CreationOptional<string | null>;
  /** JSON array of each stud's drift in % since it was last tightened. */
  declare driftJson: CreationOptional<string | null>;
  /** The same final loads as float64 bytes (lib/record/float64-blob.ts), for comparisons. */
  declare finalLoadsF64: CreationOptional<Buffer | null>;
  /** The same drift as float64 bytes (NaN where never tightened). */
  declare driftF64: CreationOptional<Buffer | null>;
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
        recordedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        assessedConfirmedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        assessedConfirmedAt: { type: DataTypes.DATE, allowNull: true },
        reviewReasons: { type: DataTypes.TEXT, allowNull: true },
        reviewedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        reviewedAt: { type: DataTypes.DATE, allowNull: true },
        reviewNote: { type: DataTypes.STRING(1000), allowNull: true },
        simulationKey: { type: DataTypes.CHAR(64), allowNull: true },
        recordedAt: { type: DataTypes.DATE, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: true },
        hardwareSetId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        hardwareUseNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        lubricantLotId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        gasketCondition: { type: DataTypes.ENUM('new', 'reused'), allowNull: true },
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
        finalLoadsF64: { type: DataTypes.BLOB, allowNull: true },
        driftF64: { type: DataTypes.BLOB, allowNull: true },
        finalGasketStressMpa: { type: DataTypes.DOUBLE, allowNull: true },
        gasketMinSeatingMpa: { type: DataTypes.DOUBLE, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
        jointVersionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        calibrationSessionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      },
      { sequelize, tableName: 'runs', underscored: true },
    );
  }
}
