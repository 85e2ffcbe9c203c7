import { AddressInfo } from 'node:net';
import { QueryTypes } from 'sequelize';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/models';
import type { SessionUser } from '@/lib/auth/session';
import { claimJobs, LOCK_EXPIRED_NOTE } from '@/lib/data/jobs/claim';
import { enqueueJob } from '@/lib/data/jobs/enqueue';
import { markJobDone } from '@/lib/data/jobs/finish';
import { purgeFinishedJobs } from '@/lib/data/jobs/purge';
import { listJobs, retryFailedJob } from '@/lib/data/jobs/admin';
import { DEFAULT_WORKER_OPTIONS, workOnce } from '@/lib/data/jobs/worker';
import { scanRefresherReminders } from '@/lib/data/reminders/refresher-scan';
import { daysBefore, refresherDedupeKey } from '@/lib/qualification/refresher';
import { newVerificationCode } from '@/lib/qualification/verification-code';
import { DEMO_ACCOUNTS, anonymous, signInAs } from '../support/http-session';
import { sharedAppServer } from '../support/shared-app-server';
import { startWorkerProcess, type WorkerProcess } from '../support/worker-process';
import { count, demoPeople, mailTo } from './support';

// Issue 17 item 5: refresher reminders through the job table. The workers are real processes
// (scripts/worker.ts, each with its own database pool and SMTP connection) against the test database
// and the tests' mail fake, which stores every message it accepts in captured_mail.
const tag = `jobs${Date.now().toString(36)}`;
const today = new Date().toISOString().slice(0, 10);
const inDays = (days: number) => daysBefore(today, -days);
const address = (name: string) => `${tag}.${name}@example.test`;
let cohortId = 0;
let people: Awaited<ReturnType<typeof demoPeople>>;
const workers: WorkerProcess[] = [];

async function traineeWithRecord(name: string, validUntil: string, extra: { revoked?: boolean; replacedById?: number } = {}): Promise<{ userId: number; recordId: number }> {
  const [userId] = await sequelize.query(
    "INSERT INTO users (name, email, password_hash, role, preferred_units, is_active, created_at, updated_at) VALUES (?, ?, 'x', 'trainee', 'si', 1, NOW(), NOW())",
    { type: QueryTypes.INSERT, replacements: [`${tag} ${name}`, address(name)] },
  );
  const [recordId] = await sequelize.query(
    `INSERT INTO training_records (code, cohort_id, user_id, trainee_name, course_name, scope, issued_on, valid_until, issued_by_id, issued_by_name, revoked_at, revoke_reason, replaced_by_id, created_at)
     VALUES (?, ?, ?, ?, 'Jobs test course', 'Hand torque', ?, ?, ?, 'Instructor', ?, ?, ?, NOW())`,
    {
      type: QueryTypes.INSERT,
      replacements: [newVerificationCode(), cohortId, userId, `${tag} ${name}`, daysBefore(validUntil, 1000), validUntil, people.instructor.id,
        extra.revoked || extra.replacedById ? new Date() : null, extra.revoked || extra.replacedById ? 'test' : null, extra.replacedById ?? null],
    },
  );
  return { userId: Number(userId), recordId: Number(recordId) };
}

const jobOf = async (recordId: number, validUntil: string) =>
  (await sequelize.query<{ id: number; status: string; attempts: number; last_error: string | null }>('SELECT id, status, attempts, last_error FROM jobs WHERE dedupe_key = ?', { type: QueryTypes.SELECT, replacements: [refresherDedupeKey(recordId, validUntil)] }))[0];

async function until(check: () => Promise<boolean>, timeoutMs: number, what: string) {
  const started = Date.now();
  while (!(await check())) {
    if (Date.now() - started > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

const fastWorker = { EVENLOAD_JOB_POLL_MS: '100', EVENLOAD_JOB_BATCH: '1', EVENLOAD_JOB_RETRY_BASE_MS: '300', EVENLOAD_JOB_RETRY_CAP_MS: '2000' };

beforeAll(async () => {
  people = await demoPeople();
  const [id] = await sequelize.query(
    "INSERT INTO cohorts (name, site, starts_on, ends_on, instructor_id, created_at, updated_at) VALUES (?, 'Test site', '2026-01-05', '2026-01-30', ?, NOW(), NOW())",
    { type: QueryTypes.INSERT, replacements: [`${tag} cohort`, people.instructor.id] },
  );
  cohortId = Number(id);
});

afterAll(async () => {
  for (const worker of workers) await worker.stop();
  await sequelize.query("DELETE FROM jobs WHERE dedupe_key IN (SELECT CONCAT('refresher:', tr.id, ':', DATE_FORMAT(tr.valid_until, '%Y-%m-%d')) FROM training_records tr WHERE tr.cohort_id = ?)", { replacements: [cohortId] });
  await sequelize.query('DELETE FROM captured_mail WHERE envelope_to LIKE ?', { replacements: [`${tag}.%`] });
  await sequelize.query('DELETE FROM users WHERE email LIKE ?', { replacements: [`${tag}.%`] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
  await sequelize.close();
});

describe('refresher reminders through the job table', () => {
  const due: { name: string; recordId: number }[] = [];
  const skipped: { name: string; recordId: number; validUntil: string }[] = [];

  it('the scan queues one reminder per live record in its lead time, and scanning again adds none', async () => {
    for (const name of ['ada', 'ben', 'cleo', 'dev', 'eli', 'fay']) due.push({ name, recordId: (await traineeWithRecord(name, inDays(20))).recordId });
    const later = await traineeWithRecord('later', inDays(120)); // 90 days' lead: not yet
    const revoked = await traineeWithRecord('revoked', inDays(20), { revoked: true });
    const replaced = await traineeWithRecord('replaced', inDays(20), { replacedById: due[0]!.recordId });
    const expired = await traineeWithRecord('expired', inDays(-1));
    skipped.push({ name: 'later', recordId: later.recordId, validUntil: inDays(120) }, { name: 'revoked', recordId: revoked.recordId, validUntil: inDays(20) },
      { name: 'replaced', recordId: replaced.recordId, validUntil: inDays(20) }, { name: 'expired', recordId: expired.recordId, validUntil: inDays(-1) });

    await scanRefresherReminders();
    for (const { recordId } of due) expect((await jobOf(recordId, inDays(20)))?.status).toBe('queued');
    for (const { recordId, validUntil } of skipped) expect(await jobOf(recordId, validUntil)).toBeUndefined();
    const jobs = await count('SELECT COUNT(*) AS n FROM jobs');
    expect(await scanRefresherReminders()).toBe(0);
    expect(await count('SELECT COUNT(*) AS n FROM jobs')).toBe(jobs);
  });

  it('two workers running at once send each reminder exactly once', async () => {
    // Both processes are up before the jobs are due, so they compete for every claim.
    await sequelize.query("UPDATE jobs SET run_after = UTC_TIMESTAMP(3) + INTERVAL 1 DAY WHERE dedupe_key LIKE 'refresher:%' AND status = 'queued' AND dedupe_key IN (?)", { replacements: [due.map((d) => refresherDedupeKey(d.recordId, inDays(20)))] });
    workers.push(await startWorkerProcess(`${tag}-w1`, fastWorker), await startWorkerProcess(`${tag}-w2`, fastWorker));
    await sequelize.query('UPDATE jobs SET run_after = UTC_TIMESTAMP(3) WHERE dedupe_key IN (?)', { replacements: [due.map((d) => refresherDedupeKey(d.recordId, inDays(20)))] });
    await until(async () => (await Promise.all(due.map((d) => jobOf(d.recordId, inDays(20))))).every((job) => job?.status === 'done'), 60_000, 'the reminders to be done');

    for (const { name } of due) {
      const mail = await mailTo(address(name)); // counted at the mail fake (captured_mail)
      expect(mail, name).toHaveLength(1);
      expect(mail[0]!.subject).toContain('valid until');
    }
    const ids = due.map((d) => d.recordId);
    expect(await count('SELECT COUNT(*) AS n FROM refresher_reminders WHERE training_record_id IN (?)', [ids])).toBe(due.length);
    const doneBy = workers.flatMap((w) => w.doneJobIds());
    const jobIds = (await Promise.all(due.map((d) => jobOf(d.recordId, inDays(20))))).map((job) => Number(job!.id));
    for (const id of jobIds) expect(doneBy.filter((d) => d === id), `job ${id} was finished by exactly one worker`).toHaveLength(1);
    console.log(`[jobs test] reminders finished by ${workers.map((w) => `${w.id}: ${w.doneJobIds().filter((id) => jobIds.includes(id)).length}`).join(', ')}`);
    for (const { name } of skipped) expect(await mailTo(address(name))).toHaveLength(0);

    // Stopped with SIGTERM, each worker finishes its turn and exits cleanly.
    for (const worker of workers.splice(0)) expect(await worker.stop()).toBe(0);
  });

  it('a reminder whose mail is refused twice is retried after the back-off and goes out once', async () => {
    const { recordId } = await traineeWithRecord('retry', inDays(10));
    const to = address('retry');
    const tries: number[] = [];
    let accepted = 0;
    const smtp = new SMTPServer({
      secure: false, authOptional: true, disabledCommands: ['STARTTLS', 'AUTH'],
      onRcptTo(rcpt, _session, callback) {
        if (rcpt.address.toLowerCase() !== to) return callback(); // other reminders of the database pass
        tries.push(Date.now());
        if (tries.length <= 2) return callback(Object.assign(new Error('Mailbox busy, try again later'), { responseCode: 451 }));
        callback();
      },
      onData(stream, session, callback) {
        stream.resume();
        stream.on('end', () => {
          if (session.envelope.rcptTo.some((r) => r.address.toLowerCase() === to)) accepted += 1;
          callback();
        });
      },
    });
    await new Promise<void>((resolve) => smtp.listen(0, '127.0.0.1', resolve));
    try {
      const port = (smtp.server.address() as AddressInfo).port;
      workers.push(await startWorkerProcess(`${tag}-retry`, { ...fastWorker, SMTP_PORT: String(port) }));
      await scanRefresherReminders();
      await until(async () => (await jobOf(recordId, inDays(10)))?.status === 'done', 60_000, 'the retried reminder');
      const job = (await jobOf(recordId, inDays(10)))!;
      expect(job.attempts).toBe(3);
      expect(job.last_error).toContain('could not be sent');
      expect(accepted).toBe(1);
      expect(tries).toHaveLength(3);
      // lib/jobs/backoff.ts with base 300 ms: at least 300 ms after the first failure, 600 ms after the second.
      expect(tries[1]! - tries[0]!).toBeGreaterThanOrEqual(300);
      expect(tries[2]! - tries[1]!).toBeGreaterThanOrEqual(600);
    } finally {
      for (const worker of workers.splice(0)) await worker.stop();
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
    }
  });

  it('a job whose worker died is put back when its lock expires and finished by another, once', async () => {
    const { recordId } = await traineeWithRecord('orphan', inDays(5));
    const { id } = await enqueueJob('refresher_reminder', { trainingRecordId: recordId, validUntil: inDays(5) }, { dedupeKey: refresherDedupeKey(recordId, inDays(5)) });
    // The "dead" worker claims everything due with a 1 s lock and never finishes.
    const claimed = await claimJobs(`${tag}-dead`, { limit: 100, lockMs: 1000 });
    expect(claimed.map((job) => Number(job.id))).toContain(id);
    const rescuer = { ...DEFAULT_WORKER_OPTIONS, workerId: `${tag}-rescuer`, retry: { baseMs: 100, capMs: 1000 }, log: () => {} };
    await workOnce(rescuer); // still locked: the rescuer leaves it alone
    expect(await count("SELECT COUNT(*) AS n FROM jobs WHERE id = ? AND status = 'running' AND locked_by = ?", [id, `${tag}-dead`])).toBe(1);
    await new Promise((resolve) => setTimeout(resolve, 1100));
    await until(async () => { await workOnce(rescuer); return (await jobOf(recordId, inDays(5)))?.status === 'done'; }, 20_000, 'the recovered job');
    const job = (await jobOf(recordId, inDays(5)))!;
    expect(job.attempts).toBe(2);
    expect(job.last_error).toBe(LOCK_EXPIRED_NOTE);
    expect(await mailTo(address('orphan'))).toHaveLength(1);
    // The dead worker coming back cannot mark it done: its lock is gone.
    expect(await sequelize.transaction((transaction) => markJobDone(id, `${tag}-dead`, transaction))).toBe(false);
  });
});

describe('old finished jobs', () => {
  it('are removed after 30 days; newer ones and failed ones stay', async () => {
    const make = async (name: string, status: string, daysAgo: number) => {
      const { id } = await enqueueJob('refresher_scan', { hour: '2026-01-01T00' }, { dedupeKey: `${tag}:${name}` });
      await sequelize.query('UPDATE jobs SET status = ?, finished_at = UTC_TIMESTAMP(3) - INTERVAL ? DAY WHERE id = ?', { replacements: [status, daysAgo, id] });
      return id;
    };
    const old = await make('old', 'done', 31);
    const recent = await make('recent', 'done', 29);
    const failed = await make('old-failed', 'failed', 60);
    expect(await purgeFinishedJobs()).toBeGreaterThanOrEqual(1);
    expect(await count('SELECT COUNT(*) AS n FROM jobs WHERE id = ?', [old])).toBe(0);
    expect(await count('SELECT COUNT(*) AS n FROM jobs WHERE id IN (?)', [[recent, failed]])).toBe(2);
    await sequelize.query('DELETE FROM jobs WHERE dedupe_key LIKE ?', { replacements: [`${tag}:%`] });
  });
});

describe('the admin jobs list', () => {
  let failedId = 0;
  beforeAll(async () => {
    ({ id: failedId } = await enqueueJob('refresher_reminder', { trainingRecordId: 999_999_999, validUntil: today }, { dedupeKey: `${tag}:failed` }));
    await sequelize.query("UPDATE jobs SET status = 'failed', attempts = 8, last_error = 'refused' WHERE id = ?", { replacements: [failedId] });
  });
  afterAll(async () => {
    await sequelize.query('DELETE FROM jobs WHERE dedupe_key = ?', { replacements: [`${tag}:failed`] });
  });

  it('is refused to everyone but admins, as data and as a page', async () => {
    for (const user of [people.trainee, people.instructor, people.researcher] as SessionUser[]) {
      await expect(listJobs(user)).rejects.toMatchObject({ code: 'forbidden' });
      await expect(retryFailedJob(user, failedId)).rejects.toMatchObject({ code: 'forbidden' });
    }
    await expect(listJobs(null)).rejects.toMatchObject({ code: 'unauthenticated' });
    const { baseUrl } = sharedAppServer();
    const trainee = await (await signInAs(baseUrl, DEMO_ACCOUNTS.trainee)).get('/admin/jobs');
    expect(trainee.status).toBe(307);
    expect(trainee.headers.get('location')).toContain('not-allowed');
    expect((await anonymous(baseUrl).get('/admin/jobs')).status).toBeGreaterThanOrEqual(300);
    const admin = await (await signInAs(baseUrl, DEMO_ACCOUNTS.admin)).get('/admin/jobs');
    expect(admin.status).toBe(200);
    expect(await admin.text()).toContain('Background jobs');
  });

  it('lists failed jobs first with their error, and an admin can queue one again', async () => {
    const listed = await listJobs(people.admin);
    expect(listed[0]!.status).toBe('failed');
    expect(listed.find((job) => job.id === failedId)).toMatchObject({ status: 'failed', attempts: 8, lastError: 'refused', kindLabel: 'Refresher reminder' });
    expect(await retryFailedJob(people.admin, failedId)).toMatchObject({ status: 'queued', attempts: 0 });
    await expect(retryFailedJob(people.admin, failedId)).rejects.toMatchObject({ code: 'conflict' });
    await sequelize.query("UPDATE jobs SET status = 'failed' WHERE id = ?", { replacements: [failedId] }); // no worker runs it here
  });
});
