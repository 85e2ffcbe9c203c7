import path from 'node:path';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug, type MigrationFn } from 'umzug';

export type Migration = MigrationFn<QueryInterface>;
export interface SeedContext {
  sequelize: Sequelize;
}
export type Seeder = MigrationFn<SeedContext>;

// The repository root (this file is lib/platform/migrator.ts).
const root = path.resolve(__dirname, '../..');

/**
 * Loads a migration file with this module's own `import()`, so whichever loader runs us (tsx for
 * the scripts, vitest for the tests) also compiles the TypeScript migration.
 */
function importMigration<C>({ name, path: file }: { name: string; path?: string }) {
  const load = async () => (await import(/* @vite-ignore */ file as string)) as { up: MigrationFn<C>; down: MigrationFn<C> };
  return {
    name,
    up: async (params: Parameters<MigrationFn<C>>[0]) => (await load()).up(params),
    down: async (params: Parameters<MigrationFn<C>>[0]) => (await load()).down(params),
  };
}

/** Migrations: schema changes, recorded in `schema_migrations`. */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug({
    migrations: { glob: ['migrations/*.ts', { cwd: root }], resolve: importMigration },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Seeders: demo data, recorded in `schema_seeds` (a separate meta table). Seeders are idempotent. */
export function createSeeder(sequelize: Sequelize) {
  return new Umzug({
    migrations: { glob: ['seeders/*.ts', { cwd: root }], resolve: importMigration },
    context: { sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_seeds' }),
    logger: undefined,
  });
}
