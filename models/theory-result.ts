import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One trainee's theory result in one cohort (`theory_results`): score in percent, the day, who entered it. */
export class TheoryResult extends Model<InferAttributes<TheoryResult>, InferCreationAttributes<TheoryResult>> {
  declare id: CreationOptional<number>;
  declare cohortId: number;
  declare userId: number;
  /** DECIMAL comes back as text from the driver; read it with Number(). */
  declare scorePercent: string | number;
  declare takenOn: string;
  declare enteredById: number;
  declare enteredByName: string;
  declare enteredAt: Date;
  /** Optimistic lock: raised by one on every save (lib/data/optimistic-lock.ts). */
  declare version: CreationOptional<number>;

  static initModel(sequelize: Sequelize) {
    TheoryResult.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        cohortId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        scorePercent: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
        takenOn: { type: DataTypes.DATEONLY, allowNull: false },
        enteredById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        enteredByName: { type: DataTypes.STRING(160), allowNull: false },
        enteredAt: { type: DataTypes.DATE, allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
      },
      { sequelize, tableName: 'theory_results', underscored: true, timestamps: false },
    );
  }
}
