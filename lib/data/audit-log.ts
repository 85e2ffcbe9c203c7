import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { AuditEntry } from '@/models';
import { AppError } from '../http/errors';
import { assertRole, type SessionUser } from '../auth/session';
import { csvRows, type CsvValue } from '../export/write-csv';

/** What the audit log keeps changes of. */
export const AUDIT_OBJECT_TYPES = ['run', 'verdict', 'criteria', 'course_outcome', 'training_record', 'account', 'calibration_session', 'theory_result', 'checklist_tick', 'saved_comparison'] as const;
export type AuditObjectType = (typeof AUDIT_OBJECT_TYPES)[number];

export interface AuditChange {
  objectType: AuditObjectType;
  objectId: number;
  /** A short verb: `set_aside`, `restore`, `sign_off`, `confirm_attempt`, `update`, `role`, … */
  action: string;
  reason?: string | null;
  before?: unknown;
  after?: unknown;
}

export interface AuditEntryDto {
  id: number;
  at: string;
  actorName: string;
  objectType: string;
  objectId: number;
  action: string;
  reason: string | null;
  before: unknown;
  after: unknown;
}

const toJson = (value: unknown): string | null => (value === undefined || value === null ? null : JSON.stringify(value));
const fromJson = (text: string | null): unknown => (text === null ? null : (JSON.parse(text) as unknown));

/**
 * Writes one audit row inside the caller's transaction, so the change and its record commit or
 * roll back together. `actor` null is the system (the job worker).
 */
export async function writeAudit(transaction: Transaction, actor: Pick<SessionUser, 'id' | 'name'> | null, change: AuditChange): Promise<void> {
  await AuditEntry.create(
    {
      actorId: actor?.id ?? null,
      actorName: (actor?.name ?? 'Evenload (automatic)').slice(0, 160),
      objectType: change.objectType,
      objectId: change.objectId,
      action: change.action.slice(0, 40),
      reason: change.reason ? change.reason.slice(0, 400) : null,
      beforeJson: toJson(change.before),
      afterJson: toJson(change.after),
      createdAt: new Date(),
    },
    { transaction },
  );
}

const entryDto = (row: AuditEntry): AuditEntryDto => ({
  id: Number(row.id),
  at: row.createdAt.toISOString(),
  actorName: row.actorName,
  objectType: row.objectType,
  objectId: Number(row.objectId),
  action: row.action,
  reason: row.reason,
  before: fromJson(row.beforeJson),
  after: fromJson(row.afterJson),
});

/**
 * The history of one object, oldest first. The caller has already checked that this person may
 * see the object; researchers never receive it (reasons are free text that may name people).
 */
export async function auditHistory(user: SessionUser, objects: ReadonlyArray<{ objectType: AuditObjectType; objectId: number }>): Promise<AuditEntryDto[]> {
  if (user.role === 'researcher' || user.role === 'trainee' || !objects.length) return [];
  const rows = await AuditEntry.findAll({
    where: { [Op.or]: objects.map((o) => ({ objectType: o.objectType, objectId: o.objectId })) },
    order: [['id', 'ASC']],
    limit: 500,
  });
  return rows.map(entryDto);
}

/** The whole audit log as CSV (admins only), newest first. */
export async function auditLogCsv(user: SessionUser | null): Promise<string> {
  assertRole(user, ['admin']);
  const rows = await AuditEntry.findAll({ order: [['id', 'DESC']], limit: 100_000 });
  if (rows.length === 100_000) throw new AppError('too_large', 'The audit log has more than 100,000 entries; ask for a database export instead.');
  return csvRows([
    ['id', 'at_utc', 'actor_id', 'actor', 'object_type', 'object_id', 'action', 'reason', 'before_json', 'after_json'],
    ...rows.map((r) => [Number(r.id), r.createdAt.toISOString(), r.actorId === null ? null : Number(r.actorId), r.actorName, r.objectType, Number(r.objectId), r.action, r.reason, r.beforeJson, r.afterJson] as CsvValue[]),
  ]);
}
