import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const ROLES = ['admin', 'instructor', 'researcher', 'trainee'] as const;
export type Role = (typeof ROLES)[number];
export type UnitSystem = 'si' | 'us';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare email: string;
  declare passwordHash: string | null;
  declare role: Role;
  declare preferredUnits: CreationOptional<UnitSystem>;
  declare employerContact: CreationOptional<string | null>;
  declare isActive: CreationOptional<boolean>;
  /** Raised to end every session of the person (role change, deactivation, reset, sign out everywhere). */
  declare sessionVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        passwordHash: { type: DataTypes.STRING(100), allowNull: true },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        preferredUnits: { type: DataTypes.ENUM('si', 'us'), allowNull: false, defaultValue: 'si' },
        employerContact: { type: DataTypes.STRING(254), allowNull: true },
        isActive: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        sessionVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        createdAt: { type: DataTypes.DATE, allowNull: false },
        updatedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'users', underscored: true },
    );
  }
}
