import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type JobStatus = 'queued' | 'running' | 'done' | 'failed';

/** One unit of background work (`jobs`): claimed by one worker at a time, retried with back-off (lib/data/jobs). */
export class Job extends Model<InferAttributes<Job>, InferCreationAttributes<Job>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  /** JSON, checked against the kind's zod schema (lib/jobs/job-kinds.ts) when enqueued and when run. */
  declare payload: string;
  /** Unique: enqueueing the same key again adds nothing. */
  declare dedupeKey: string;
  declare status: CreationOptional<JobStatus>;
  declare runAfter: Date;
  declare attempts: CreationOptional<number>;
  declare maxAttempts: CreationOptional<number>;
  declare lastError: string | null;
  declare lockedBy: string | null;
  declare lockedUntil: Date | null;
  declare finishedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Job.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        payload: { type: DataTypes.TEXT, allowNull: false },
        dedupeKey: { type: DataTypes.STRING(191), allowNull: false, unique: true },
        status: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'queued' },
        runAfter: { type: DataTypes.DATE(3), allowNull: false },
        attempts: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        maxAttempts: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 8 },
        lastError: { type: DataTypes.STRING(1000), allowNull: true },
        lockedBy: { type: DataTypes.STRING(80), allowNull: true },
        lockedUntil: { type: DataTypes.DATE(3), allowNull: true },
        finishedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: { type: DataTypes.DATE(3), allowNull: false },
        updatedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'jobs', underscored: true },
    );
  }
}
