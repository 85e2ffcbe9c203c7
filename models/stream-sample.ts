import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One live reading as the bridge sent it, keyed by run, time and position (a resent batch writes nothing new). */
export class StreamSample extends Model<InferAttributes<StreamSample>, InferCreationAttributes<StreamSample>> {
  declare runId: number;
  declare timeS: number;
  declare position: number;
  declare loadN: number;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize) {
    StreamSample.init(
      {
        runId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        timeS: { type: DataTypes.DOUBLE, primaryKey: true },
        position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        loadN: { type: DataTypes.DOUBLE, allowNull: false },
        receivedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'stream_samples', underscored: true, timestamps: false },
    );
  }
}
