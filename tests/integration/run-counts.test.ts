import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import type { SessionUser } from '@/lib/auth/session';
import { listRuns, runListQuerySchema } from '@/lib/data/runs';
import { restoreRun, setRunAside } from '@/lib/data/qualification/attempts';
import { reviewRun } from '@/lib/data/runs/run-review';
import { storeFixtureRun } from './run-fixture';
import { count, demoPeople } from './support';

/**
 * The runs list's total comes from `run_counts`, kept by triggers on `runs` and `cohorts`. The
 * expected side is always MariaDB's own COUNT(*) over `runs`, with each role's scope written out in
 * SQL here (the rule in DEVELOPERS.md "Layout": researchers and admins all runs, instructors their
 * cohorts' runs and their own, trainees their own).
 */
let people: Awaited<ReturnType<typeof demoPeople>>;
let cohortId: number;
const created: number[] = [];

const scopeSql = (user: SessionUser) =>
  user.role === 'trainee' ? `operator_id = ${user.id}`
    : user.role === 'instructor' ? `(operator_id = ${user.id} OR cohort_id IN (SELECT id FROM cohorts WHERE instructor_id = ${user.id}))`
    : '1 = 1';

async function expectTotalsRight(filters: Record<string, string> = {}, where = '1 = 1') {
  for (const user of Object.values(people)) {
    const page = await listRuns(user, runListQuerySchema.parse({ ...filters, pageSize: 5 }));
    expect(page.total, `${user.role} ${user.email} ${JSON.stringify(filters)}`).toBe(await count(`SELECT COUNT(*) AS n FROM runs WHERE ${scopeSql(user)} AND ${where}`));
  }
}

/** Every counter key against a GROUP BY of the runs themselves (keys whose counters fell to 0 aside). */
async function expectCountersMatchRuns() {
  const q = (sql: string) => sequelize.query<{ k: string; n: number }>(sql, { type: QueryTypes.SELECT });
  const counted = await q("SELECT CONCAT_WS('/', operator_id, COALESCE(cohort_id, 0), status, source) AS k, COUNT(*) AS n FROM runs GROUP BY k ORDER BY k");
  const kept = await q("SELECT CONCAT_WS('/', operator_id, cohort_id, status, source) AS k, SUM(n) AS n FROM run_counts GROUP BY k HAVING SUM(n) <> 0 ORDER BY k");
  expect(kept.map((r) => [r.k, Number(r.n)])).toEqual(counted.map((r) => [r.k, Number(r.n)]));
}

beforeAll(async () => {
  people = await demoPeople();
  const [cohort] = await sequelize.query<{ id: number }>('SELECT id FROM cohorts WHERE instructor_id = ? ORDER BY id LIMIT 1', { type: QueryTypes.SELECT, replacements: [people.instructor.id] });
  cohortId = cohort!.id;
});

afterAll(async () => {
  if (created.length) await sequelize.query('DELETE FROM runs WHERE id IN (?)', { replacements: [created] });
  await sequelize.close();
});

const loads = [60_000, 61_000, 59_500, 60_200, 60_800, 59_900, 60_100, 60_400];

describe('runs list total from the maintained counts', () => {
  it('matches COUNT(*) for every role, unfiltered and by status, source, cohort and method', async () => {
    await expectCountersMatchRuns();
    await expectTotalsRight();
    await expectTotalsRight({ status: 'complete' }, "status = 'complete'");
    await expectTotalsRight({ source: 'simulated' }, "source = 'simulated'");
    await expectTotalsRight({ cohortId: String(cohortId) }, `cohort_id = ${cohortId}`);
    const [method] = await sequelize.query<{ id: number }>('SELECT id FROM methods ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
    await expectTotalsRight({ methodId: String(method!.id), status: 'complete' }, `method_id = ${method!.id} AND status = 'complete'`);
  });

  it('stays right after a run is stored, set aside, restored, reviewed and deleted', async () => {
    const before = await count('SELECT COUNT(*) AS n FROM runs');
    const runId = await storeFixtureRun({ operatorId: people.trainee.id, cohortId, finalLoadsN: loads });
    created.push(runId);
    expect((await listRuns(people.researcher, runListQuerySchema.parse({}))).total).toBe(before + 1);
    await expectTotalsRight();
    await expectCountersMatchRuns();

    await setRunAside(people.instructor, runId, 'Gauge dropped during the run.');
    await expectTotalsRight({ status: 'set_aside' }, "status = 'set_aside'");
    await expectTotalsRight({ status: 'complete' }, "status = 'complete'");
    await restoreRun(people.instructor, runId, 'Gauge checked, the run stands.');
    await expectTotalsRight({ status: 'set_aside' }, "status = 'set_aside'");
    await expectCountersMatchRuns();

    // A run held by the check: the status changes by SQL here (any writer fires the triggers), then the review confirms it.
    await sequelize.query("UPDATE runs SET status = 'needs_review' WHERE id = ?", { replacements: [runId] });
    await expectTotalsRight({ status: 'needs_review' }, "status = 'needs_review'");
    await reviewRun(people.instructor, runId, { note: 'Checked the loads by hand.' });
    await expectTotalsRight({ status: 'needs_review' }, "status = 'needs_review'");
    await expectTotalsRight({ status: 'complete' }, "status = 'complete'");

    await sequelize.query('DELETE FROM runs WHERE id = ?', { replacements: [runId] });
    created.pop();
    expect((await listRuns(people.researcher, runListQuerySchema.parse({}))).total).toBe(before);
    await expectTotalsRight();
    await expectCountersMatchRuns();
  });

  it('moves a deleted cohort\'s runs to "no cohort" (the foreign key sets NULL without firing the runs triggers)', async () => {
    const [inserted] = await sequelize.query(
      "INSERT INTO cohorts (name, site, starts_on, ends_on, instructor_id, created_at, updated_at) VALUES ('Run count test cohort (invented)', 'Test site', '2026-01-05', '2026-01-09', ?, NOW(), NOW())",
      { type: QueryTypes.INSERT, replacements: [people.instructor.id] },
    );
    const tempCohort = Number(inserted);
    const runId = await storeFixtureRun({ operatorId: people.trainee.id, cohortId: tempCohort, finalLoadsN: loads });
    created.push(runId);
    await expectTotalsRight({ cohortId: String(tempCohort) }, `cohort_id = ${tempCohort}`);
    await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [tempCohort] });
    expect(await count('SELECT COUNT(*) AS n FROM runs WHERE id = ? AND cohort_id IS NULL', [runId])).toBe(1);
    await expectCountersMatchRuns();
    await expectTotalsRight();
  });
});
