import { QueryTypes, type Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize, sequelize } from '@/lib/platform/db';
import { env } from '@/lib/platform/env';
import { createMigrator } from '@/lib/platform/migrator';

const scratchName = `${env.DB_NAME}_scratch`;
let scratch: Sequelize;

beforeAll(async () => {
  await sequelize.query(`DROP DATABASE IF EXISTS \`${scratchName}\``);
  await sequelize.query(`CREATE DATABASE \`${scratchName}\``);
  scratch = createSequelize(scratchName);
});

afterAll(async () => {
  await scratch?.close();
  await sequelize.query(`DROP DATABASE IF EXISTS \`${scratchName}\``);
  await sequelize.close();
});

const tablesOf = async (db: Sequelize) =>
  (await db.query<Record<string, string>>('SHOW TABLES', { type: QueryTypes.SELECT })).map((row) => Object.values(row)[0]).sort();

describe('MariaDB through Sequelize', () => {
  // Guards the Sequelize 6 + mariadb 3.x bug (sequelize issue 15701, SETUP-NOTES): without the
  // driver wrapper in lib/platform/mariadb-driver.ts, a raw query throws "Cannot delete property 'meta'".
  it('runs a raw query and returns its rows with the metadata separate', async () => {
    const [rows, meta] = await sequelize.query('SELECT 1 + 1 AS two, ? AS word', { replacements: ['stud'] });
    expect(rows).toEqual([{ two: 2, word: 'stud' }]);
    expect(Array.isArray(meta)).toBe(true);
  });

  it('applies every migration up, reverts them all down, and applies them up again', async () => {
    const migrator = createMigrator(scratch);
    const pending = await migrator.pending();
    expect(pending.length).toBeGreaterThanOrEqual(3);
    await migrator.up();
    const afterUp = await tablesOf(scratch);
    for (const table of ['users', 'cohorts', 'cohort_members', 'joints', 'joint_positions', 'methods', 'lubricants', 'runs', 'tightening_steps', 'readings', 'uploads']) {
      expect(afterUp).toContain(table);
    }
    await migrator.down({ to: 0 });
    expect(await tablesOf(scratch)).toEqual(['schema_migrations']);
    await migrator.up();
    expect(await tablesOf(scratch)).toEqual(afterUp);
  });

  it('creates the indexes the runs queries need', async () => {
    const indexes = await sequelize.query<{ Key_name: string }>('SHOW INDEX FROM runs', { type: QueryTypes.SELECT });
    const names = new Set(indexes.map((i) => i.Key_name));
    for (const name of ['runs_method_recorded', 'runs_lubricant_recorded', 'runs_cohort_recorded', 'runs_operator_recorded', 'runs_recorded']) {
      expect(names).toContain(name);
    }
    const readingIndexes = await sequelize.query<{ Key_name: string }>('SHOW INDEX FROM readings', { type: QueryTypes.SELECT });
    expect(readingIndexes.map((i) => i.Key_name)).toContain('readings_run_step');
  });
});
