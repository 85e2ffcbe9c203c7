import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { JointSnapshot } from '../lib/joints/joint-snapshot';

/** A joint as it stood from one change to the next (runs point at the version they were recorded on). */
export class JointVersion extends Model<InferAttributes<JointVersion>, InferCreationAttributes<JointVersion>> {
  declare id: CreationOptional<number>;
  declare jointId: number;
  declare versionNumber: number;
  declare snapshot: JointSnapshot;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    JointVersion.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        jointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        versionNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        snapshot: { type: DataTypes.JSON, allowNull: false },
        createdAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'joint_versions', underscored: true, updatedAt: false },
    );
  }
}
