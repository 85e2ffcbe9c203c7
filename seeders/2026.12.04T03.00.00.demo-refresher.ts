/**
 * Demo data: one record of training that runs out 30 days after seeding (invented, like the rest of
 * the demo school), so the worker's refresher scan queues a reminder the admin sees under Jobs and the
 * mail shows in the outbox. Idempotent: nothing happens when that trainee already has a record.
 */
import { QueryTypes } from 'sequelize';
import type { Seeder } from '../lib/platform/migrator';
import { buildDemoScenario } from '../lib/demo/demo-scenario';
import { daysBefore } from '../lib/qualification/refresher';
import { newVerificationCode } from '../lib/qualification/verification-code';

const DAYS_LEFT = 30;

/** The demo cohort and trainee the record belongs to: the last trainee of the first cohort (not the README's demo trainee). */
function demoRecordHolder() {
  const cohort = buildDemoScenario().cohorts[0];
  if (!cohort) throw new Error('The demo scenario has no cohort.');
  return { cohort, email: cohort.traineeEmails[cohort.traineeEmails.length - 1]! };
}

export const up: Seeder = async ({ context: { sequelize } }) => {
  const { cohort, email } = demoRecordHolder();
  const select = <T extends object>(sql: string, replacements: unknown[]) => sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
  const [trainee] = await select<{ id: number; name: string }>('SELECT id, name FROM users WHERE email = ?', [email]);
  const [row] = await select<{ id: number; name: string; instructor_id: number; instructor_name: string }>(
    'SELECT c.id, c.name, c.instructor_id, u.name AS instructor_name FROM cohorts c JOIN users u ON u.id = c.instructor_id WHERE c.name = ? AND u.email = ?',
    [cohort.name, cohort.instructorEmail],
  );
  if (!trainee || !row) return; // the demo scenario is not seeded here
  const [existing] = await select<{ n: number }>('SELECT COUNT(*) AS n FROM training_records WHERE user_id = ?', [trainee.id]);
  if (Number(existing!.n) > 0) return;

  const now = new Date();
  const today = now.toISOString().slice(0, 10);
  const validUntil = daysBefore(today, -DAYS_LEFT);
  const issuedOn = cohort.endsOn < today ? cohort.endsOn : today;
  const scopes = ['Hand torque'];
  await sequelize.transaction(async (transaction) => {
    const q = (sql: string, replacements: unknown[]) => sequelize.query(sql, { type: QueryTypes.INSERT, transaction, replacements });
    await q(
      `INSERT INTO course_outcomes (cohort_id, user_id, decision, scopes, decided_by_id, decided_by_name, decided_at, version)
       VALUES (?,?,?,?,?,?,?,1) ON DUPLICATE KEY UPDATE decision = decision`,
      [row.id, trainee.id, 'pass', JSON.stringify(scopes), row.instructor_id, row.instructor_name, new Date(`${issuedOn}T15:00:00Z`)],
    );
    await q(
      `INSERT INTO training_records (code, cohort_id, user_id, trainee_name, course_name, scope, issued_on, valid_until, issued_by_id, issued_by_name, created_at)
       VALUES (?,?,?,?,?,?,?,?,?,?,?)`,
      [newVerificationCode(), row.id, trainee.id, trainee.name, row.name, scopes.join(', '), issuedOn, validUntil, row.instructor_id, row.instructor_name, now],
    );
  });
};

export const down: Seeder = async ({ context: { sequelize } }) => {
  const { email } = demoRecordHolder();
  await sequelize.query('DELETE tr FROM training_records tr JOIN users u ON u.id = tr.user_id WHERE u.email = ?', { replacements: [email] });
};
