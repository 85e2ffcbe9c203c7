import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One piece (at most 1 MB) of an uploaded file; the pieces in `chunkIndex` order are the file. */
export class UploadChunk extends Model<InferAttributes<UploadChunk>, InferCreationAttributes<UploadChunk>> {
  declare uploadId: number;
  declare chunkIndex: number;
  declare bytes: Buffer;

  static initModel(sequelize: Sequelize) {
    UploadChunk.init(
      {
        uploadId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        chunkIndex: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        bytes: { type: DataTypes.BLOB('medium'), allowNull: false },
      },
      { sequelize, tableName: 'upload_chunks', underscored: true, timestamps: false },
    );
  }
}
