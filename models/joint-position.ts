import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class JointPosition extends Model<InferAttributes<JointPosition>, InferCreationAttributes<JointPosition>> {
  declare jointId: number;
  declare position: number;
  declare calibrationFactor: CreationOptional<number>;
  declare note: CreationOptional<string | null>;
  /** The logger channel wired to this position (`CH3`, `AI2`, `SG-1041`); null = channel k is position k. */
  declare channel: CreationOptional<string | null>;

  static initModel(sequelize: Sequelize) {
    JointPosition.init(
      {
        jointId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
        calibrationFactor: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 1 },
        note: { type: DataTypes.STRING(240), allowNull: true },
        channel: { type: DataTypes.STRING(60), allowNull: true },
      },
      { sequelize, tableName: 'joint_positions', underscored: true, timestamps: false },
    );
  }
}
