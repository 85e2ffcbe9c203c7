import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('users', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    password_hash: { type: DataTypes.STRING(100), allowNull: true },
    role: { type: DataTypes.ENUM('admin', 'instructor', 'researcher', 'trainee'), allowNull: false },
    preferred_units: { type: DataTypes.ENUM('si', 'us'), allowNull: false, defaultValue: 'si' },
    employer_contact: { type: DataTypes.STRING(254), allowNull: true },
    is_active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('users', ['role'], { name: 'users_role' });

  await qi.createTable('cohorts', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    site: { type: DataTypes.STRING(160), allowNull: false },
    starts_on: { type: DataTypes.DATEONLY, allowNull: false },
    ends_on: { type: DataTypes.DATEONLY, allowNull: false },
    instructor_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('cohorts', ['instructor_id'], { name: 'cohorts_instructor' });

  await qi.createTable('cohort_members', {
    cohort_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'cohorts', key: 'id' },
      onDelete: 'CASCADE',
    },
    user_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('cohort_members', ['user_id'], { name: 'cohort_members_user' });

  // Sign-in attempts per key (account e-mail or client address), for rate limiting that works
  // across several app instances.
  await qi.createTable('sign_in_attempts', {
    attempt_key: { type: DataTypes.STRING(300), primaryKey: true },
    failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    window_started_at: { type: DataTypes.DATE, allowNull: false },
    locked_until: { type: DataTypes.DATE, allowNull: true },
  });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('sign_in_attempts');
  await qi.dropTable('cohort_members');
  await qi.dropTable('cohorts');
  await qi.dropTable('users');
};
