import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class RunComment extends Model<InferAttributes<RunComment>, InferCreationAttributes<RunComment>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare authorId: number;
  declare body: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RunComment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'run_comments', underscored: true, updatedAt: false },
    );
  }
}
