import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** An uploaded logger file: its sha256, size and parse report; the bytes are in `upload_chunks` (UploadChunk). */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>;
  declare runId: number | null;
  declare uploadedById: number;
  declare fileName: string;
  declare sha256: string;
  declare sizeBytes: number;
  declare contentType: string;
  /** What the server parse found (detection, mapping, warnings), as JSON. */
  declare parseReport: CreationOptional<object | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Upload.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        uploadedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        contentType: { type: DataTypes.STRING(120), allowNull: false },
        parseReport: { type: DataTypes.JSON, allowNull: true },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'uploads', underscored: true, updatedAt: false },
    );
  }
}
