import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One change to a run, verdict, criteria, course outcome, record of training or account (`audit_log`). */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare actorId: number | null;
  declare actorName: string;
  declare objectType: string;
  declare objectId: number;
  declare action: string;
  declare reason: string | null;
  declare beforeJson: string | null;
  declare afterJson: string | null;
  declare createdAt: Date;

  static initModel(sequelize: Sequelize) {
    AuditEntry.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        actorName: { type: DataTypes.STRING(160), allowNull: false },
        objectType: { type: DataTypes.STRING(40), allowNull: false },
        objectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        action: { type: DataTypes.STRING(40), allowNull: false },
        reason: { type: DataTypes.STRING(400), allowNull: true },
        beforeJson: { type: DataTypes.TEXT('long'), allowNull: true },
        afterJson: { type: DataTypes.TEXT('long'), allowNull: true },
        createdAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: 'audit_log', underscored: true, timestamps: false },
    );
  }
}
