import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A message caught by the local SMTP fake (development, demo and tests only). */
export class CapturedMail extends Model<InferAttributes<CapturedMail>, InferCreationAttributes<CapturedMail>> {
  declare id: CreationOptional<number>;
  declare messageId: string | null;
  declare envelopeFrom: string | null;
  declare envelopeTo: string;
  declare subject: string | null;
  declare textBody: string | null;
  declare htmlBody: string | null;
  declare raw: string;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize) {
    CapturedMail.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        messageId: { type: DataTypes.STRING(300), allowNull: true },
        envelopeFrom: { type: DataTypes.STRING(300), allowNull: true },
        envelopeTo: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.STRING(400), allowNull: true },
        textBody: { type: DataTypes.TEXT('long'), allowNull: true },
        htmlBody: { type: DataTypes.TEXT('long'), allowNull: true },
        raw: { type: DataTypes.TEXT('long'), allowNull: false },
        receivedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'captured_mail', underscored: true, timestamps: false },
    );
  }
}
