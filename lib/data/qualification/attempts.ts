import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { z } from 'zod';
import { Run, sequelize } from '@/models';
import { AppError } from '../../http/errors';
import type { SessionUser } from '../../auth/session';
import { attemptKind, notAssessedReason, runSourceLine, type AttemptFacts, type AttemptKind } from '../../qualification/attempt-kind';
import type { RunSource } from '@/models/run';
import { auditHistory, writeAudit, type AuditEntryDto } from '../audit-log';
import { operatorLabel, runScope } from '../scope';
import { REVIEW_ROLES } from '../runs/run-review';

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
    canSetAside: (row.status === 'complete' || row.status === 'needs_review') && maySetAside(user, row),
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

const parseStatusReason = (rawReason: unknown): string => {
  const reason = statusReasonSchema.safeParse(rawReason);
  if (reason.success) return reason.data;
  const message = reason.error.issues[0]?.message ?? 'Give a reason.';
  throw new AppError('invalid_input', message, { field: 'reason', fieldErrors: { reason: [message] } });
};

/**
 * Who may set a run aside. A complete run: instructors the runs of the cohorts they teach and their
 * own, researchers their own runs outside cohorts, admins any (`mayChangeStatus`). A run held for
 * review: whoever may review it (instructors, researchers and admins who may see it), as before.
 */
const maySetAside = (user: SessionUser, row: FactsRow): boolean => (row.status === 'needs_review' ? REVIEW_ROLES.includes(user.role) : mayChangeStatus(user, row));

/**
 * The one way a run is set aside (out of comparisons, progress and assessments), from the attempt
 * panel and the needs-review panel alike: a complete run, or one held for review (then who decided,
 * when and the reason are kept as its review too). The change and its audit row commit together; a
 * refusal changes no row.
 */
export async function setRunAside(user: SessionUser, runId: number, rawReason: unknown): Promise<void> {
  const reason = parseStatusReason(rawReason);
  const visible = Number.isInteger(runId) ? await Run.count({ where: { [Op.and]: [await runScope(user), { id: runId }] } }) : 0;
  if (!visible) throw new AppError('not_found', 'That run does not exist, or it is not yours to change.');
  await sequelize.transaction(async (transaction) => {
    await Run.findByPk(runId, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
    const row = await attemptRow(runId, transaction);
    if (!row || !maySetAside(user, row)) throw new AppError('not_found', 'That run does not exist, or it is not yours to change.');
    if (row.status !== 'complete' && row.status !== 'needs_review') throw new AppError('conflict', `Only a complete run or one held for review can be set aside; this run is ${row.status.replace('_', ' ')}.`);
    const review = row.status === 'needs_review' ? { reviewedById: user.id, reviewedAt: new Date(), reviewNote: reason } : {};
    await Run.update({ status: 'set_aside', setAsideReason: reason, setAsideById: user.id, ...review }, { where: { id: runId }, transaction });
    await writeAudit(transaction, user, {
      objectType: 'run',
      objectId: runId,
      action: 'set_aside',
      reason,
      before: { status: row.status, setAsideReason: row.set_aside_reason },
      after: { status: 'set_aside', setAsideReason: reason },
    });
  });
}

/**
 * Restores a set-aside run with a reason (the same people as setting a complete run aside). It goes
 * back to the status it was set aside from, as the audit row of that set-aside recorded it: a run
 * set aside while held for review is held again (it never passed the check, and restoring must not
 * let it count unconfirmed); a complete run counts again. Runs set aside before the audit log
 * existed (no such row) return to complete.
 */
export async function restoreRun(user: SessionUser, runId: number, rawReason: unknown): Promise<void> {
  const reason = parseStatusReason(rawReason);
  await sequelize.transaction(async (transaction) => {
    const row = await lockedRun(user, runId, transaction);
    if (row.status !== 'set_aside') throw new AppError('conflict', 'This run is not set aside; nothing was changed.');
    const status = (await statusBeforeSetAside(runId, transaction)) === 'needs_review' ? ('needs_review' as const) : ('complete' as const);
    await Run.update({ status, setAsideReason: null, setAsideById: null }, { where: { id: runId }, transaction });
    await writeAudit(transaction, user, {
      objectType: 'run',
      objectId: runId,
      action: 'restore',
      reason,
      before: { status: row.status, setAsideReason: row.set_aside_reason },
      after: { status, setAsideReason: null },
    });
  });
}

/** The status a run had when it was last set aside, from that audit row; null when there is none. */
async function statusBeforeSetAside(runId: number, transaction: Transaction): Promise<string | null> {
  const [entry] = await sequelize.query<{ before_json: string | null }>(
    "SELECT before_json FROM audit_log WHERE object_type = 'run' AND object_id = ? AND action = 'set_aside' ORDER BY id DESC LIMIT 1",
    { type: QueryTypes.SELECT, replacements: [runId], transaction },
  );
  const before = entry?.before_json ? (JSON.parse(entry.before_json) as { status?: unknown }) : null;
  return typeof before?.status === 'string' ? before.status : null;
}
