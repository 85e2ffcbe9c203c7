import { QueryTypes, type Model, type ModelStatic, type QueryInterfaceCreateTableOptions, type Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize, sequelize } from '@/lib/platform/db';
import { env } from '@/lib/platform/env';
import { MODELS } from '@/models';

/**
 * Every table the migrations create has a Sequelize model, and each model declares exactly its
 * table's columns with the same type, nullability, key and auto-increment. The comparison is made
 * by MariaDB itself: the models are created as tables in a scratch database, and both schemas are
 * read back from information_schema (so DataTypes.JSON and LONGTEXT, INTEGER and int(10) compare as
 * the server stores them). The expected side is the test database, migrated by `npm test`.
 */
// The scratch database the test user may create (scripts/db.sh grants it; database.test.ts uses it too, files run one at a time).
const scratchName = `${env.DB_NAME}_scratch`;
const BOOKKEEPING = new Set(['schema_migrations', 'schema_seeds']);
let scratch: Sequelize;

interface ColumnRow {
  table_name: string;
  column_name: string;
  column_type: string;
  is_nullable: string;
  column_key: string;
  extra: string;
}

/** Columns by table, each as "name type NULL|NOT NULL [PRI] [auto_increment]", in column order. */
async function columnsOf(schema: string): Promise<Map<string, string[]>> {
  const rows = await sequelize.query<ColumnRow>(
    `SELECT TABLE_NAME AS table_name, COLUMN_NAME AS column_name, COLUMN_TYPE AS column_type, IS_NULLABLE AS is_nullable,
            COLUMN_KEY AS column_key, EXTRA AS extra
     FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = ? ORDER BY TABLE_NAME, ORDINAL_POSITION`,
    { type: QueryTypes.SELECT, replacements: [schema] },
  );
  const tables = new Map<string, string[]>();
  for (const row of rows) {
    if (BOOKKEEPING.has(row.table_name)) continue;
    const description = [row.column_name, row.column_type, row.is_nullable === 'YES' ? 'NULL' : 'NOT NULL', row.column_key === 'PRI' ? 'PRI' : '', row.extra.includes('auto_increment') ? 'auto_increment' : '']
      .filter(Boolean)
      .join(' ');
    tables.set(row.table_name, [...(tables.get(row.table_name) ?? []), description]);
  }
  // Column order differs between a model and a table grown by addColumn: compare as sorted lists.
  for (const [table, columns] of tables) tables.set(table, columns.sort());
  return tables;
}

beforeAll(async () => {
  await sequelize.query(`DROP DATABASE IF EXISTS \`${scratchName}\``);
  await sequelize.query(`CREATE DATABASE \`${scratchName}\``);
  scratch = createSequelize(scratchName);
  const qi = scratch.getQueryInterface();
  for (const model of MODELS) {
    // Foreign keys are left out: they need the referenced table first and are not what is compared.
    const table = model as unknown as ModelStatic<Model>;
    await qi.createTable(table.getTableName(), table.getAttributes(), { withoutForeignKeyConstraints: true } as QueryInterfaceCreateTableOptions);
  }
});

afterAll(async () => {
  await scratch?.close();
  await sequelize.query(`DROP DATABASE IF EXISTS \`${scratchName}\``);
  await sequelize.close();
});

describe('models match the migrated schema', () => {
  it('every table the migrations create has a model, and every model has its table', async () => {
    const migrated = await columnsOf(env.DB_NAME);
    const modelled = await columnsOf(scratchName);
    // Source of the expected list: the migrations in migrations/, as applied to the test database.
    expect([...modelled.keys()].sort()).toEqual([...migrated.keys()].sort());
    expect(migrated.size).toBeGreaterThanOrEqual(23);
  });

  it('each model declares exactly its table\'s columns, with the same type, nullability and key', async () => {
    const migrated = await columnsOf(env.DB_NAME);
    const modelled = await columnsOf(scratchName);
    // One comparison of every table, so a failure lists every difference at once.
    expect(Object.fromEntries(modelled)).toEqual(Object.fromEntries(migrated));
  });
});
