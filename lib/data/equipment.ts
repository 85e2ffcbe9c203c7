import 'server-only';
import { Op, QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { AppError } from '@/lib/http/errors';
import type { EquipmentInput } from '@/lib/equipment/equipment-input';
import type { EquipmentKind } from '@/lib/equipment/equipment-kinds';
import { toolsPastDue } from '@/lib/equipment/tools-past-due';
import { checkToolsDue, withToolReason } from '@/lib/run-check/check-tools-due';
import type { RunCheckReason } from '@/lib/run-check/types';
import { writeAudit } from './audit-log';
import { Equipment, Run, RunTool, sequelize } from '@/models';
import { assertRole, type SessionUser } from '../auth/session';
import { nextVersion } from './optimistic-lock';
import { runScope } from './scope';

/**
 * The equipment register: admins keep it; instructors and admins read it to record the tools a
 * run was made with. A tool past its due date on the day of a run is flagged on that run.
 */
export interface EquipmentItem {
  id: number;
  kind: EquipmentKind;
  name: string;
  serialNumber: string;
  certificate: string | null;
  calibratedOn: string | null;
  dueOn: string | null;
  inService: boolean;
  version: number;
}

const item = (e: Equipment): EquipmentItem => ({
  id: e.id,
  kind: e.kind,
  name: e.name,
  serialNumber: e.serialNumber,
  certificate: e.certificate,
  calibratedOn: e.calibratedOn,
  dueOn: e.dueOn,
  inService: e.inService,
  version: e.version,
});

/** The register, by kind and name; soonest due first within a kind is left to the page. */
export async function listEquipment(user: SessionUser): Promise<EquipmentItem[]> {
  assertRole(user, ['admin', 'instructor']);
  return (await Equipment.findAll({ order: [['kind', 'ASC'], ['name', 'ASC']] })).map(item);
}

export async function getEquipment(user: SessionUser, id: number): Promise<EquipmentItem | null> {
  assertRole(user, ['admin']);
  const row = await Equipment.findByPk(id);
  return row ? item(row) : null;
}

/** Creates (id null) or updates an item (admin; optimistic locking like the library forms). */
export async function saveEquipment(user: SessionUser, id: number | null, input: EquipmentInput, sentVersion?: unknown): Promise<{ id: number }> {
  assertRole(user, ['admin']);
  try {
    return await sequelize.transaction(async (transaction) => {
      if (id === null) return { id: (await Equipment.create(input, { transaction })).id };
      const row = await Equipment.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!row) throw new AppError('not_found', 'There is no such item in the register; it may have been removed.');
      await row.update({ ...input, version: nextVersion(row.version, sentVersion) }, { transaction });
      return { id };
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new AppError('conflict', `A ${input.kind.replace('_', ' ')} with serial number "${input.serialNumber}" is already in the register.`, { field: 'serialNumber' });
    throw error;
  }
}

export interface RunToolView extends EquipmentItem {
  /** Past its due date (or never calibrated) on the day the run was recorded. */
  pastDue: boolean;
}

async function visibleRun(user: SessionUser, runId: number): Promise<Run> {
  const run = await Run.findOne({ where: { [Op.and]: [{ id: runId }, await runScope(user)] } });
  if (!run) throw new AppError('not_found', 'This run does not exist, or it is not yours to see.');
  return run;
}

/** The tools a run was made with, each flagged when it was past due on the run's day. */
export async function runTools(user: SessionUser, runId: number): Promise<RunToolView[]> {
  const run = await visibleRun(user, runId);
  const links = await RunTool.findAll({ where: { runId } });
  if (links.length === 0) return [];
  const tools = (await Equipment.findAll({ where: { id: links.map((l) => l.equipmentId) }, order: [['kind', 'ASC'], ['name', 'ASC']] })).map(item);
  const late = new Set(toolsPastDue(tools, run.recordedAt.toISOString().slice(0, 10)).map((t) => t.id));
  return tools.map((t) => ({ ...t, pastDue: late.has(t.id) }));
}

/**
 * Replaces the tools recorded for a run (instructors and admins, on runs they may see), in one
 * transaction, and runs the tools-in-date check on them: a tool past due on the run's day holds a
 * complete run for review (reason "tool_past_due"); taking the late tool off releases a run that was
 * held for that reason alone. Either status change is written to the audit log.
 */
export async function setRunTools(user: SessionUser, runId: number, equipmentIds: number[]): Promise<void> {
  assertRole(user, ['admin', 'instructor']);
  await visibleRun(user, runId);
  const ids = [...new Set(equipmentIds)];
  await sequelize.transaction(async (transaction) => {
    const [locked] = await sequelize.query<{ status: string; review_reasons: string | null; recorded_at: Date }>(
      'SELECT status, review_reasons, recorded_at FROM runs WHERE id = ? FOR UPDATE',
      { type: QueryTypes.SELECT, transaction, replacements: [runId] },
    );
    if (!locked) throw new AppError('not_found', 'This run does not exist, or it is not yours to see.');
    const tools = ids.length === 0 ? [] : (await Equipment.findAll({ where: { id: ids }, transaction })).map(item);
    if (tools.length !== ids.length) {
      throw new AppError('invalid_input', 'One of the chosen tools is not in the register; reload the page.', { field: 'tools' });
    }
    await RunTool.destroy({ where: { runId }, transaction });
    if (ids.length > 0) await RunTool.bulkCreate(ids.map((equipmentId) => ({ runId, equipmentId })), { transaction });
    await applyToolCheck(user, runId, locked, checkToolsDue(tools, new Date(locked.recorded_at).toISOString().slice(0, 10)), transaction);
  });
}

/** Writes the tool check's outcome on a locked run row: its reasons, and its status where it changes. */
async function applyToolCheck(user: SessionUser, runId: number, locked: { status: string; review_reasons: string | null }, toolReason: RunCheckReason | null, transaction: Transaction): Promise<void> {
  const before: RunCheckReason[] = locked.review_reasons ? JSON.parse(locked.review_reasons) : [];
  const after = withToolReason(before, toolReason);
  if (JSON.stringify(before) === JSON.stringify(after)) return;
  let status = locked.status;
  if (toolReason && status === 'complete') status = 'needs_review';
  else if (!toolReason && status === 'needs_review' && after.length === 0) status = 'complete';
  const held = status === 'needs_review' && locked.status !== 'needs_review';
  await Run.update(
    { status: status as Run['status'], reviewReasons: after.length > 0 ? JSON.stringify(after) : null, ...(held ? { reviewedById: null, reviewedAt: null, reviewNote: null } : {}) },
    { where: { id: runId }, transaction },
  );
  if (status !== locked.status || toolReason) {
    await writeAudit(transaction, user, {
      objectType: 'run',
      objectId: runId,
      action: 'tool_check',
      reason: toolReason?.message ?? 'No tool past calibration on the run\'s day.',
      before: { status: locked.status },
      after: { status },
    });
  }
}
