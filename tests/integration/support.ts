import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/platform/db';
import type { SessionUser } from '@/lib/auth/session';
import { DEMO_ACCOUNTS } from '../support/http-session';

export const count = async (sql: string, replacements: unknown[] = []) =>
  Number((await sequelize.query<{ n: number }>(sql, { type: QueryTypes.SELECT, replacements }))[0]!.n);

/** The signed-in person as lib/data receives it, read from the users table. */
export async function sessionUserFor(email: string): Promise<SessionUser> {
  const [row] = await sequelize.query<{ id: number; name: string; email: string; role: SessionUser['role'] }>(
    'SELECT id, name, email, role FROM users WHERE email = ?',
    { type: QueryTypes.SELECT, replacements: [email] },
  );
  if (!row) throw new Error(`no account ${email}`);
  return { id: Number(row.id), name: row.name, email: row.email, role: row.role, units: 'si' };
}

/** Row counts of the tables the cohort features write, to prove that a refusal changed nothing. */
export async function tableCounts() {
  const tables = ['users', 'cohorts', 'cohort_members', 'one_time_tokens', 'cohort_criteria', 'run_verdicts', 'captured_mail'];
  const out: Record<string, number> = {};
  for (const table of tables) out[table] = await count(`SELECT COUNT(*) AS n FROM ${table}`);
  return out;
}

export async function mailTo(address: string) {
  return sequelize.query<{ id: number; subject: string; text_body: string }>(
    'SELECT id, subject, text_body FROM captured_mail WHERE FIND_IN_SET(?, envelope_to) ORDER BY id',
    { type: QueryTypes.SELECT, replacements: [address.toLowerCase()] },
  );
}

/**
 * A server action's answer as the browser would see it: the form state it returned, or where it
 * sent the browser (Next's `redirect()` throws an error whose digest carries the address).
 */
export async function actionOutcome<S>(call: Promise<S>): Promise<S | { redirectedTo: string }> {
  try {
    return await call;
  } catch (error) {
    const digest = (error as { digest?: unknown } | null)?.digest;
    if (typeof digest === 'string' && digest.startsWith('NEXT_REDIRECT;')) return { redirectedTo: digest.split(';')[2]! };
    throw error;
  }
}

/** The demo's signed-in people most tests need (a second instructor teaches other cohorts). */
export async function demoPeople() {
  return {
    instructor: await sessionUserFor(DEMO_ACCOUNTS.instructor),
    otherInstructor: await sessionUserFor('kwame.duchesne@demo.evenload.test'),
    trainee: await sessionUserFor(DEMO_ACCOUNTS.trainee),
    researcher: await sessionUserFor(DEMO_ACCOUNTS.researcher),
    admin: await sessionUserFor(DEMO_ACCOUNTS.admin),
  };
}

/** Removes a test cohort with its runs, verdicts and course evidence, and the audit rows of all of them. */
export async function removeCohortAndEvidence(cohortId: number) {
  const ids = async (sql: string) => (await sequelize.query<{ id: number }>(sql, { type: QueryTypes.SELECT, replacements: [cohortId] })).map((r) => r.id);
  const byType: Record<string, number[]> = {
    theory_result: await ids('SELECT id FROM theory_results WHERE cohort_id = ?'),
    checklist_tick: await ids('SELECT t.id FROM checklist_ticks t JOIN checklist_items i ON i.id = t.item_id WHERE i.cohort_id = ?'),
    course_outcome: await ids('SELECT id FROM course_outcomes WHERE cohort_id = ?'),
    training_record: await ids('SELECT id FROM training_records WHERE cohort_id = ?'),
    run: await ids('SELECT id FROM runs WHERE cohort_id = ?'),
    criteria: [cohortId],
  };
  for (const [type, list] of Object.entries(byType)) if (list.length) await sequelize.query('DELETE FROM audit_log WHERE object_type = ? AND object_id IN (?)', { replacements: [type, list] });
  await sequelize.query('DELETE FROM run_verdicts WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM runs WHERE cohort_id = ?', { replacements: [cohortId] });
  await sequelize.query('DELETE FROM cohorts WHERE id = ?', { replacements: [cohortId] });
}
