import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class TighteningStep extends Model<InferAttributes<TighteningStep>, InferCreationAttributes<TighteningStep>> {
  declare id: CreationOptional<number>;
  declare runId: number;
  declare stepOrder: number;
  declare passNumber: number;
  declare position: number;
  declare appliedTorqueNm: CreationOptional<number | null>;
  declare appliedPressureBar: CreationOptional<number | null>;
  declare timeS: CreationOptional<number | null>;

  static initModel(sequelize: Sequelize) {
    TighteningStep.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        stepOrder: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        passNumber: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        position: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        appliedTorqueNm: { type: DataTypes.DOUBLE, allowNull: true },
        appliedPressureBar: { type: DataTypes.DOUBLE, allowNull: true },
        timeS: { type: DataTypes.DOUBLE, allowNull: true },
      },
      { sequelize, tableName: 'tightening_steps', underscored: true, timestamps: false },
    );
  }
}
