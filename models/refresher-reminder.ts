import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * A refresher reminder that went out (`refresher_reminders`): one per record of training and
 * valid-until date (unique), written in the same transaction that marks its job done.
 */
export class RefresherReminder extends Model<InferAttributes<RefresherReminder>, InferCreationAttributes<RefresherReminder>> {
  declare id: CreationOptional<number>;
  declare trainingRecordId: number;
  declare validUntil: string;
  declare jobId: number | null;
  declare sentTo: string;
  declare messageId: string;
  declare sentAt: Date;

  static initModel(sequelize: Sequelize) {
    RefresherReminder.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        trainingRecordId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        validUntil: { type: DataTypes.DATEONLY, allowNull: false },
        jobId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        sentTo: { type: DataTypes.STRING(254), allowNull: false },
        messageId: { type: DataTypes.STRING(200), allowNull: false },
        sentAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'refresher_reminders', underscored: true, timestamps: false },
    );
  }
}
