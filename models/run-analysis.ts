import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One run's stored analysis (the JSON GET /api/runs/:id/analysis serves) and its ETag. */
export class RunAnalysisRow extends Model<InferAttributes<RunAnalysisRow>, InferCreationAttributes<RunAnalysisRow>> {
  declare runId: number;
  declare etag: string;
  declare bodyJson: string;
  declare updatedAt: Date;

  static initModel(sequelize: Sequelize) {
    RunAnalysisRow.init(
      {
        runId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        etag: { type: DataTypes.STRING(64), allowNull: false },
        bodyJson: { type: DataTypes.TEXT('long'), allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'run_analyses', underscored: true, createdAt: false },
    );
  }
}
