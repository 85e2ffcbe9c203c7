import * as mariadb from 'mariadb';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { env } from '@/lib/platform/env';
import type { SessionUser } from '@/lib/auth/session';
import { listRuns, listRunsJson, runListQuerySchema, type RunPage } from '@/lib/data/runs';
import { runListVersion } from '@/lib/data/run-list-memo';
import { pseudonymFor } from '@/lib/data/pseudonym';
import { storeFixtureRun } from './run-fixture';
import { count, demoPeople } from './support';

/**
 * `GET /api/runs` answers from a memo checked against the version stamp in MariaDB
 * (`lib/data/run-list-memo.ts`). Every change here is made the way another app instance or a script
 * would make it: raw SQL on a connection of its own, outside this process's code. The expected side
 * is MariaDB itself (the row as SELECTed, COUNT(*) over the person's scope) and the unremembered
 * `listRuns`, never the memo.
 */
let people: Awaited<ReturnType<typeof demoPeople>>;
let other: mariadb.Connection;
let cohortId: number;
const created: number[] = [];
const loads = [60_000, 61_000, 59_500, 60_200, 60_800, 59_900, 60_100, 60_400];

const page = async (user: SessionUser, query: Record<string, string> = {}): Promise<RunPage> => JSON.parse(await listRunsJson(user, runListQuerySchema.parse({ cohortId: String(cohortId), ...query }))) as RunPage;
const fresh = (user: SessionUser, query: Record<string, string> = {}) => listRuns(user, runListQuerySchema.parse({ cohortId: String(cohortId), ...query }));
const rowOf = async (user: SessionUser, runId: number) => (await page(user)).rows.find((r) => r.id === runId);

beforeAll(async () => {
  people = await demoPeople();
  other = await mariadb.createConnection({ host: env.DB_HOST, port: env.DB_PORT, user: env.DB_USER, password: env.DB_PASSWORD, database: env.DB_NAME });
  const [inserted] = await sequelize.query(
    "INSERT INTO cohorts (name, site, starts_on, ends_on, instructor_id, created_at, updated_at) VALUES ('Memo test cohort (invented)', 'Test site', '2026-01-05', '2026-01-09', ?, NOW(), NOW())",
    { type: QueryTypes.INSERT, replacements: [people.instructor.id] },
  );
  cohortId = Number(inserted);
  created.push(await storeFixtureRun({ operatorId: people.trainee.id, cohortId, finalLoadsN: loads }));
});

afterAll(async () => {
  if (created.length) await sequelize.query('DELETE FROM runs WHERE id IN (?)', { replacements: [created] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await other.end();
  await sequelize.close();
});

describe('runs list memo', () => {
  it('answers what the list computes afresh, for every role', async () => {
    for (const user of Object.values(people)) {
      const queries: Record<string, string>[] = [{}, { sort: 'finalCv', dir: 'asc' }, { status: 'complete', pageSize: '1' }];
      for (const query of queries) {
        const expected = await fresh(user, query);
        expect(await page(user, query), `${user.role} ${JSON.stringify(query)}`).toEqual(expected);
        // The repeat (from the memo while nothing changed) is the same answer.
        expect(await page(user, query), `${user.role} repeat`).toEqual(expected);
      }
    }
  });

  it('never serves one person the page remembered for another (scope and names)', async () => {
    const [runId] = created;
    const [trainee] = await sequelize.query<{ name: string }>('SELECT name FROM users WHERE id = ?', { type: QueryTypes.SELECT, replacements: [people.trainee.id] });
    // The researcher asks first, so a memo keyed by the query alone would hand the trainee's request the pseudonymised page.
    expect((await rowOf(people.researcher, runId!))?.operatorName).toBe(pseudonymFor(people.trainee.id));
    expect((await rowOf(people.trainee, runId!))?.operatorName).toBe(trainee!.name);
    // An instructor who does not teach the cohort sees none of its runs (only their own, none of which are in it).
    expect((await page(people.otherInstructor)).total).toBe(await count('SELECT COUNT(*) AS n FROM runs WHERE cohort_id = ? AND operator_id = ?', [cohortId, people.otherInstructor.id]));
    expect((await page(people.instructor)).total).toBe(await count('SELECT COUNT(*) AS n FROM runs WHERE cohort_id = ?', [cohortId]));
  });

  it('shows a run stored, changed or deleted elsewhere at the next request', async () => {
    const before = await page(people.researcher);
    const runId = await storeFixtureRun({ operatorId: people.trainee.id, cohortId, finalLoadsN: loads });
    created.push(runId);
    expect((await page(people.researcher)).total).toBe(before.total + 1);
    expect(await rowOf(people.researcher, runId)).toBeDefined();

    await other.query("UPDATE runs SET status = 'set_aside', final_cv = 0.123 WHERE id = ?", [runId]);
    expect(await rowOf(people.researcher, runId)).toMatchObject({ status: 'set_aside', finalCv: 0.123 });
    expect((await page(people.researcher, { status: 'complete' })).rows.some((r) => r.id === runId)).toBe(false);

    await other.query('DELETE FROM runs WHERE id = ?', [runId]);
    created.pop();
    expect(await rowOf(people.researcher, runId)).toBeUndefined();
    expect((await page(people.researcher)).total).toBe(before.total);
  });

  it('shows a renamed joint, method, lubricant, operator and cohort at the next request', async () => {
    const [runId] = created;
    const [run] = await sequelize.query<{ joint_id: number; method_id: number; lubricant_id: number }>('SELECT joint_id, method_id, lubricant_id FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    const renames = [
      { table: 'joints', id: run!.joint_id, field: 'jointName' },
      { table: 'methods', id: run!.method_id, field: 'methodName' },
      { table: 'lubricants', id: run!.lubricant_id, field: 'lubricantName' },
      { table: 'users', id: people.trainee.id, field: 'operatorName' },
      { table: 'cohorts', id: cohortId, field: 'cohortName' },
    ] as const;
    for (const { table, id, field } of renames) {
      const [{ name }] = (await other.query(`SELECT name FROM ${table} WHERE id = ?`, [id])) as [{ name: string }];
      await page(people.admin);
      try {
        await other.query(`UPDATE ${table} SET name = ? WHERE id = ?`, [`${name} (renamed in test)`, id]);
        expect((await rowOf(people.admin, runId!))?.[field], table).toBe(`${name} (renamed in test)`);
      } finally {
        await other.query(`UPDATE ${table} SET name = ? WHERE id = ?`, [name, id]);
      }
      expect((await rowOf(people.admin, runId!))?.[field], `${table} back`).toBe(name);
    }
  });

  it('sees a change when its transaction commits, not before (the stamp moves with the data)', async () => {
    const [runId] = created;
    await page(people.researcher);
    await other.beginTransaction();
    let committed = false;
    try {
      await other.query('UPDATE runs SET pass_count = pass_count + 7 WHERE id = ?', [runId]);
      const before = (await fresh(people.researcher)).rows.find((r) => r.id === runId)!;
      expect(await rowOf(people.researcher, runId!)).toEqual(before);
      await other.commit();
      committed = true;
      expect((await rowOf(people.researcher, runId!))?.passCount).toBe(before.passCount + 7);
    } finally {
      // A failed check must not leave the row locked for the tests after it.
      if (!committed) await other.rollback();
    }
    await other.query('UPDATE runs SET pass_count = pass_count - 7 WHERE id = ?', [runId]);
  });

  it('keeps the stamp when a column the list does not show changes, and raises it when a listed one does', async () => {
    const [runId] = created;
    const stamp = await runListVersion();
    await other.query("UPDATE runs SET notes = 'Memo test note (invented).' WHERE id = ?", [runId]);
    expect(await runListVersion()).toBe(stamp);
    await other.query('UPDATE runs SET final_mean_n = final_mean_n + 1 WHERE id = ?', [runId]);
    expect(BigInt(await runListVersion())).toBeGreaterThan(BigInt(stamp));
  });
});
