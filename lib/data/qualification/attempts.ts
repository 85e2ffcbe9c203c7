import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { z } from 'zod';
import { Run, sequelize } from '@/models';
import { AppError } from '../../http/errors';
import type { SessionUser } from '../../auth/session';
import { attemptKind, notAssessedReason, runSourceLine, type AttemptFacts, type AttemptKind } from '../../qualification/attempt-kind';
import type { RunSource } from '@/models/run';
import { auditHistory, writeAudit, type AuditEntryDto } from '../audit-log';
import { operatorLabel } from '../scope';

interface FactsRow {
  id: number;
  source: RunSource;
  status: string;
  operator_id: number;
  cohort_id: number | null;
  cohort_instructor_id: number | null;
  recorded_by_id: number | null;
  recorded_by_name: string | null;
  assessed_confirmed_by_id: number | null;
  confirmed_by_name: string | null;
  set_aside_reason: string | null;
  has_verdict: number;
}

/** The facts about one run that decide whether it is an assessed attempt (inside a transaction when given). */
export async function attemptRow(runId: number, transaction?: Transaction): Promise<FactsRow | null> {
  const [row] = await sequelize.query<FactsRow>(
    `SELECT r.id, r.source, r.status, r.operator_id, r.cohort_id, c.instructor_id AS cohort_instructor_id, r.recorded_by_id, rb.name AS recorded_by_name,
            r.assessed_confirmed_by_id, cb.name AS confirmed_by_name, r.set_aside_reason, (SELECT COUNT(*) FROM run_verdicts v WHERE v.run_id = r.id) AS has_verdict
     FROM runs r LEFT JOIN cohorts c ON c.id = r.cohort_id LEFT JOIN users rb ON rb.id = r.recorded_by_id LEFT JOIN users cb ON cb.id = r.assessed_confirmed_by_id
     WHERE r.id = ?`,
    { type: QueryTypes.SELECT, replacements: [runId], transaction },
  );
  return row ?? null;
}

export const factsOf = (row: FactsRow): AttemptFacts => ({
  source: row.source,
  cohortInstructorId: row.cohort_instructor_id === null ? null : Number(row.cohort_instructor_id),
  recordedById: row.recorded_by_id === null ? null : Number(row.recorded_by_id),
  assessedConfirmedById: row.assessed_confirmed_by_id === null ? null : Number(row.assessed_confirmed_by_id),
});

/** Refuses (422) a run that is not an assessed attempt: simulated, outside a cohort or recorded by the trainee and not confirmed. */
export function assertAssessedAttempt(row: FactsRow): void {
  const reason = notAssessedReason(factsOf(row));
  if (reason) throw new AppError('invalid_input', reason);
}

export interface RunAttemptDto {
  kind: AttemptKind;
  sourceLine: string;
  status: string;
  setAsideReason: string | null;
  /** The viewer is the cohort's instructor and the run is a trainee's unconfirmed practice run. */
  canConfirm: boolean;
  canSetAside: boolean;
  canRestore: boolean;
  history: AuditEntryDto[];
}

const mayChangeStatus = (user: SessionUser, row: FactsRow): boolean => {
  if (user.role === 'admin') return true;
  if (user.role === 'instructor') return Number(row.cohort_instructor_id) === user.id || Number(row.operator_id) === user.id;
  // Researchers set aside their own research runs (recorded by or of themselves), never a cohort's attempts.
  if (user.role === 'researcher') return row.cohort_id === null && (Number(row.operator_id) === user.id || Number(row.recorded_by_id) === user.id);
  return false;
};

/** How the run report shows a run as an attempt (the caller has already checked the viewer may see the run). */
export async function runAttempt(user: SessionUser, runId: number): Promise<RunAttemptDto> {
  const row = await attemptRow(runId);
  if (!row) throw new AppError('not_found', 'This run does not exist, or it is not yours to see.');
  const facts = factsOf(row);
  const kind = attemptKind(facts);
  const name = (id: number | null, text: string | null) => (id === null || text === null ? null : operatorLabel(user, { id, name: text }));
  return {
    kind,
    sourceLine: runSourceLine(row.source, name(facts.recordedById, row.recorded_by_name), name(facts.assessedConfirmedById, row.confirmed_by_name)),
    status: row.status,
    setAsideReason: user.role === 'researcher' ? null : row.set_aside_reason,
    canConfirm: kind === 'practice' && facts.cohortInstructorId === user.id && row.status === 'complete',
    canSetAside: row.status === 'complete' && mayChangeStatus(user, row),
    canRestore: row.status === 'set_aside' && mayChangeStatus(user, row),
    history: await auditHistory(user, [{ objectType: 'run', objectId: runId }]),
  };
}

/** Locks a run and its facts for a change; 404 when this person may not change it. */
async function lockedRun(user: SessionUser, runId: number, transaction: Transaction): Promise<FactsRow> {
  await Run.findByPk(runId, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
  const row = await attemptRow(runId, transaction);
  if (!row || !mayChangeStatus(user, row)) throw new AppError('not_found', 'That run does not exist, or it is not yours to change.');
  return row;
}

/**
 * The cohort's instructor confirms that they witnessed a run the trainee recorded: from now on it
 * is an assessed attempt. Written with its audit row in one transaction.
 */
export async function confirmAttempt(user: SessionUser, runId: number): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const row = await lockedRun(user, runId, transaction);
    const facts = factsOf(row);
    if (facts.cohortInstructorId !== user.id) throw new AppError('forbidden', 'Only the cohort’s instructor can confirm they witnessed this run.');
    if (row.status !== 'complete') throw new AppError('invalid_input', 'Only a complete run can be confirmed as an attempt.');
    const kind = attemptKind(facts);
    if (kind === 'simulated') throw new AppError('invalid_input', 'A simulated run cannot be confirmed as an attempt.');
    if (kind === 'assessed') throw new AppError('conflict', 'This run already counts as an assessed attempt; nothing was changed.');
    const at = new Date();
    await Run.update({ assessedConfirmedById: user.id, assessedConfirmedAt: at }, { where: { id: runId }, transaction });
    await writeAudit(transaction, user, { objectType: 'run', objectId: runId, action: 'confirm_attempt', before: { assessedConfirmedById: null }, after: { assessedConfirmedById: user.id, assessedConfirmedAt: at.toISOString() } });
  });
}

export const statusReasonSchema = z
  .string({ error: 'Give a reason.' })
  .trim()
  .min(3, 'Give a reason (at least 3 characters), so others know why.')
  .max(400, 'Keep the reason under 400 characters.');

/**
 * Sets a run aside (out of comparisons, progress and assessments) or restores it, with a reason.
 * Instructors: runs of the cohorts they teach and their own; researchers: their own runs outside
 * cohorts; admins: any. The change and its audit row commit together.
 */
export async function changeRunStatus(user: SessionUser, runId: number, to: 'set_aside' | 'complete', rawReason: unknown): Promise<void> {
  const reason = statusReasonSchema.safeParse(rawReason);
  if (!reason.success) {
    const message = reason.error.issues[0]?.message ?? 'Give a reason.';
    throw new AppError('invalid_input', message, { field: 'reason', fieldErrors: { reason: [message] } });
  }
  await sequelize.transaction(async (transaction) => {
    const row = await lockedRun(user, runId, transaction);
    const from = to === 'set_aside' ? 'complete' : 'set_aside';
    if (row.status !== from) {
      throw new AppError('conflict', to === 'set_aside' ? `Only a complete run can be set aside; this run is ${row.status.replace('_', ' ')}.` : 'This run is not set aside; nothing was changed.');
    }
    const values = to === 'set_aside' ? { status: to, setAsideReason: reason.data, setAsideById: user.id } : { status: to, setAsideReason: null, setAsideById: null };
    await Run.update(values, { where: { id: runId }, transaction });
    await writeAudit(transaction, user, {
      objectType: 'run',
      objectId: runId,
      action: to === 'set_aside' ? 'set_aside' : 'restore',
      reason: reason.data,
      before: { status: row.status, setAsideReason: row.set_aside_reason },
      after: { status: to, setAsideReason: values.setAsideReason },
    });
  });
}
