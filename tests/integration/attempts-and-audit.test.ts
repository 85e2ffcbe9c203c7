import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { signOffRun } from '@/lib/data/assessment';
import { createCohort } from '@/lib/data/cohorts';
import { compareQuerySchema, compareRuns } from '@/lib/data/compare';
import { auditLogCsv } from '@/lib/data/audit-log';
import { confirmAttempt, restoreRun, runAttempt, setRunAside } from '@/lib/data/qualification/attempts';
import type { SessionUser } from '@/lib/auth/session';
import { jointTarget, storeFixtureRun } from './run-fixture';
import { count, demoPeople, tableCounts } from './support';

// Issue 17: only witnessed runs are assessed attempts; set-aside runs leave comparisons; every change is in the audit log.
const stamp = Date.now().toString(36);
let instructor: SessionUser;
let otherInstructor: SessionUser;
let trainee: SessionUser;
let researcher: SessionUser;
let admin: SessionUser;
let cohortId: number;
let finalLoadsN: number[];

/** Everything a refused sign-off must leave alone: the cohort tables, the audit log and the run's own row. */
async function rowsOf(runId: number) {
  const [run] = await sequelize.query('SELECT status, assessed_confirmed_by_id, updated_at FROM runs WHERE id = ?', { type: QueryTypes.SELECT, replacements: [runId] });
  return { ...(await tableCounts()), audit: await count('SELECT COUNT(*) AS n FROM audit_log'), run };
}

beforeAll(async () => {
  ({ instructor, otherInstructor, trainee, researcher, admin } = await demoPeople());
  cohortId = await createCohort(instructor, { name: `Attempts ${stamp}`, site: 'Test bay (invented)', startsOn: '2026-12-01', endsOn: '2026-12-05' });
  const target = await jointTarget();
  finalLoadsN = Array.from({ length: 8 }, () => target);
});

afterAll(async () => {
  const runIds = (await sequelize.query<{ id: number }>('SELECT id FROM runs WHERE cohort_id = ?', { type: QueryTypes.SELECT, replacements: [cohortId] })).map((r) => r.id);
  if (runIds.length) await sequelize.query("DELETE FROM audit_log WHERE object_type = 'run' AND object_id IN (?)", { replacements: [runIds] });
  await sequelize.query('DELETE FROM run_verdicts WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM runs WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await sequelize.close();
});

describe('assessed attempts', () => {
  it('refuses to sign off a simulated run, even one the instructor made, and changes no row', async () => {
    const runId = await storeFixtureRun({ operatorId: trainee.id, cohortId, finalLoadsN, source: 'simulated', recordedById: instructor.id });
    const before = await rowsOf(runId);
    await expect(signOffRun(instructor, runId, 'looks even')).rejects.toMatchObject({ code: 'invalid_input', message: expect.stringContaining('simulated') });
    expect(await rowsOf(runId)).toEqual(before);
    expect((await runAttempt(instructor, runId)).kind).toBe('simulated');
  });

  it('refuses a run the trainee recorded of themselves until the cohort’s instructor confirms it; then it can be signed off', async () => {
    const runId = await storeFixtureRun({ operatorId: trainee.id, cohortId, finalLoadsN, source: 'upload', recordedById: trainee.id });
    expect(await runAttempt(instructor, runId)).toMatchObject({ kind: 'practice', canConfirm: true, sourceLine: `Logger file uploaded by ${trainee.name}` });
    const before = await rowsOf(runId);
    await expect(signOffRun(instructor, runId, 'witnessed?')).rejects.toMatchObject({ code: 'invalid_input', message: expect.stringContaining('practice') });
    expect(await rowsOf(runId)).toEqual(before);

    // Another cohort's instructor cannot confirm it, and the trainee cannot confirm their own run.
    await expect(confirmAttempt(otherInstructor, runId)).rejects.toMatchObject({ code: 'not_found' });
    await expect(confirmAttempt(trainee, runId)).rejects.toMatchObject({ code: 'not_found' });
    await confirmAttempt(instructor, runId);
    await expect(confirmAttempt(instructor, runId)).rejects.toMatchObject({ code: 'conflict' });
    expect(await runAttempt(instructor, runId)).toMatchObject({ kind: 'assessed', sourceLine: `Logger file uploaded by ${trainee.name}; confirmed as witnessed by ${instructor.name}` });

    const { verdictId } = await signOffRun(instructor, runId, 'Witnessed; even work.');
    expect(await count("SELECT COUNT(*) AS n FROM audit_log WHERE object_type = 'run' AND object_id = ? AND action IN ('confirm_attempt', 'sign_off')", [runId])).toBe(2);
    expect(await count("SELECT COUNT(*) AS n FROM audit_log WHERE object_type = 'verdict' AND object_id = ? AND action = 'sign_off' AND actor_id = ?", [verdictId, instructor.id])).toBe(1);
  });

  it('signs off a run the cohort’s instructor entered by hand without a confirmation', async () => {
    const runId = await storeFixtureRun({ operatorId: trainee.id, cohortId, finalLoadsN });
    expect((await runAttempt(instructor, runId)).kind).toBe('assessed');
    await expect(signOffRun(instructor, runId, 'Witnessed.')).resolves.toMatchObject({ allMet: true });
  });
});

describe('setting a run aside', () => {
  it('writes an audit row with the reason, before and after, takes the run out of comparisons, and restores it', async () => {
    const runId = await storeFixtureRun({ operatorId: trainee.id, cohortId, finalLoadsN });
    const query = compareQuerySchema.parse({ by: 'cohort' });
    const inCohort = async () => (await compareRuns(admin, query)).groups.find((g) => g.key === String(cohortId))?.runs ?? 0;
    const runsBefore = await inCohort();
    expect(runsBefore).toBeGreaterThan(0);

    await expect(setRunAside(instructor, runId, ' ')).rejects.toMatchObject({ code: 'invalid_input', details: { field: 'reason' } });
    await expect(setRunAside(researcher, runId, 'Research: a cohort run')).rejects.toMatchObject({ code: 'not_found' });
    await expect(setRunAside(otherInstructor, runId, 'Not my cohort')).rejects.toMatchObject({ code: 'not_found' });
    await setRunAside(instructor, runId, 'Load cell 3 out of calibration');

    const [entry] = await sequelize.query<{ actor_id: number; action: string; reason: string; before_json: string; after_json: string }>(
      "SELECT actor_id, action, reason, before_json, after_json FROM audit_log WHERE object_type = 'run' AND object_id = ? ORDER BY id DESC LIMIT 1",
      { type: QueryTypes.SELECT, replacements: [runId] },
    );
    expect(entry).toMatchObject({ actor_id: instructor.id, action: 'set_aside', reason: 'Load cell 3 out of calibration' });
    expect(JSON.parse(entry!.before_json)).toMatchObject({ status: 'complete' });
    expect(JSON.parse(entry!.after_json)).toMatchObject({ status: 'set_aside', setAsideReason: 'Load cell 3 out of calibration' });
    expect(await inCohort()).toBe(runsBefore - 1);
    await expect(signOffRun(instructor, runId, 'no')).rejects.toMatchObject({ code: 'invalid_input' });
    expect((await runAttempt(instructor, runId)).history.map((h) => h.action)).toEqual(['set_aside']);

    await restoreRun(admin, runId, 'Calibration checked again: fine');
    expect(await inCohort()).toBe(runsBefore);
    expect((await runAttempt(instructor, runId)).history.map((h) => h.action)).toEqual(['set_aside', 'restore']);
    expect(await auditLogCsv(admin)).toContain('Calibration checked again: fine');
    await expect(auditLogCsv(instructor)).rejects.toMatchObject({ code: 'forbidden' });
  });
});
