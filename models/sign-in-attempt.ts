import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Failed sign-ins per key (e-mail or client address), kept in MariaDB so every instance sees them. */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare attemptKey: string;
  declare failures: number;
  declare windowStartedAt: Date;
  declare lockedUntil: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize) {
    SignInAttempt.init(
      {
        attemptKey: { type: DataTypes.STRING(300), primaryKey: true },
        failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        windowStartedAt: { type: DataTypes.DATE, allowNull: false },
        lockedUntil: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'sign_in_attempts', underscored: true, timestamps: false },
    );
  }
}
