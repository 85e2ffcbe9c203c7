import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One record of training (`training_records`): what the verify page shows, frozen at issue, and its revocation. */
export class TrainingRecord extends Model<InferAttributes<TrainingRecord>, InferCreationAttributes<TrainingRecord>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare cohortId: number;
  declare userId: number;
  declare traineeName: string;
  declare courseName: string;
  declare scope: string;
  declare issuedOn: string;
  declare validUntil: string;
  declare issuedById: number;
  declare issuedByName: string;
  declare revokedAt: Date | null;
  declare revokeReason: string | null;
  declare replacedById: number | null;
  declare createdAt: Date;

  static initModel(sequelize: Sequelize) {
    TrainingRecord.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.CHAR(16), allowNull: false, unique: true },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        traineeName: { type: DataTypes.STRING(160), allowNull: false },
        courseName: { type: DataTypes.STRING(160), allowNull: false },
        scope: { type: DataTypes.STRING(400), allowNull: false },
        issuedOn: { type: DataTypes.DATEONLY, allowNull: false },
        validUntil: { type: DataTypes.DATEONLY, allowNull: false },
        issuedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        issuedByName: { type: DataTypes.STRING(160), allowNull: false },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        revokeReason: { type: DataTypes.STRING(400), allowNull: true },
        replacedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'training_records', underscored: true, timestamps: false },
    );
  }
}
