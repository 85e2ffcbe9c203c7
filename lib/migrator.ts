import path from 'node:path';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';

export type Migration = MigrationFn<QueryInterface>;
export interface SeedContext {
  sequelize: Sequelize;
}
export type Seeder = MigrationFn<SeedContext>;

const root = path.resolve(__dirname, '..');

/** Migrations: schema changes, recorded in `schema_migrations`. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: { glob: ['migrations/*.ts', { cwd: root }] },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Seeders: demo data, recorded in `schema_seeds` (a separate meta table). Seeders are idempotent. */
export function createSeeder(sequelize: Sequelize) {
  return new Umzug({
    migrations: { glob: ['seeders/*.ts', { cwd: root }] },
    context: { sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_seeds' }),
    logger: undefined,
  });
}
