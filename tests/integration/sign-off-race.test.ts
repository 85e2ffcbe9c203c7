import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { signOffRun } from '@/lib/data/assessment';
import { createCohort } from '@/lib/data/cohorts';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';
import { jointTarget, storeFixtureRun } from './run-fixture';
import { count, sessionUserFor } from './support';

// Issue 13 (low): four simultaneous sign-offs gave one success and three "Something went wrong" (a deadlock).
let instructor: SessionUser;
let cohortId: number;
let runId: number;

beforeAll(async () => {
  instructor = await sessionUserFor(DEMO_ACCOUNTS.instructor);
  const trainee = await sessionUserFor(DEMO_ACCOUNTS.trainee);
  cohortId = await createCohort(instructor, { name: `Sign-off race ${Date.now().toString(36)}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
  const target = await jointTarget();
  runId = await storeFixtureRun({ operatorId: trainee.id, cohortId, finalLoadsN: Array.from({ length: 8 }, () => target) });
});

afterAll(async () => {
  await sequelize.query('DELETE FROM runs WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await sequelize.close();
});

describe('signing a run off', () => {
  it('four simultaneous sign-offs give one success and "already signed off" for the other three', async () => {
    const results = await Promise.allSettled([1, 2, 3, 4].map((n) => signOffRun(instructor, runId, `Sign-off ${n}`)));
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    const refused = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
    expect(refused).toHaveLength(3);
    for (const { reason } of refused) expect(reason).toMatchObject({ code: 'conflict', message: expect.stringContaining('already signed off') });
    expect(await count('SELECT COUNT(*) AS n FROM run_verdicts WHERE run_id = ?', [runId])).toBe(1);
    const [verdict] = await sequelize.query<{ comment: string }>('SELECT comment FROM run_verdicts WHERE run_id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
    const winner = results.findIndex((r) => r.status === 'fulfilled');
    expect(verdict?.comment).toBe(`Sign-off ${winner + 1}`);
  });
});
