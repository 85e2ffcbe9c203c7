import 'server-only';
import { Op } from 'sequelize';
import { Job, sequelize } from '@/models';
import { AppError } from '../../http/errors';
import { assertRole, type SessionUser } from '../../auth/session';
import { JOB_KIND_LABEL, isJobKind } from '../../jobs/job-kinds';
import type { JobStatus } from '@/models/job';

export interface JobDto {
  id: number;
  kind: string;
  kindLabel: string;
  status: JobStatus;
  attempts: number;
  maxAttempts: number;
  /** When it runs next (queued), when its hold ends (running), or null (done, failed). */
  nextRunAt: string | null;
  lastError: string | null;
  finishedAt: string | null;
  createdAt: string;
}

const LIST_LIMIT = 200;

function jobDto(row: Job): JobDto {
  const status = row.status as JobStatus;
  return {
    id: Number(row.id),
    kind: row.kind,
    kindLabel: isJobKind(row.kind) ? JOB_KIND_LABEL[row.kind] : row.kind,
    status,
    attempts: row.attempts,
    maxAttempts: row.maxAttempts,
    nextRunAt: status === 'queued' ? row.runAfter.toISOString() : status === 'running' ? (row.lockedUntil?.toISOString() ?? null) : null,
    lastError: row.lastError,
    finishedAt: row.finishedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}

/** The admin's jobs list: failed first, then running and queued, then the latest done (at most 200). */
export async function listJobs(user: SessionUser | null): Promise<JobDto[]> {
  assertRole(user, ['admin']);
  const open = await Job.findAll({ where: { status: { [Op.ne]: 'done' } }, order: [['id', 'DESC']], limit: LIST_LIMIT });
  const done = await Job.findAll({ where: { status: 'done' }, order: [['id', 'DESC']], limit: Math.max(0, LIST_LIMIT - open.length) });
  const rank: Record<string, number> = { failed: 0, running: 1, queued: 2 };
  return [...open.sort((a, b) => (rank[a.status] ?? 3) - (rank[b.status] ?? 3)), ...done].map(jobDto);
}

/** Puts a failed job back in the queue to run now, with its attempts counted afresh (admin). */
export async function retryFailedJob(user: SessionUser | null, jobId: number): Promise<JobDto> {
  assertRole(user, ['admin']);
  return sequelize.transaction(async (transaction) => {
    const job = Number.isInteger(jobId) ? await Job.findByPk(jobId, { transaction, lock: transaction.LOCK.UPDATE }) : null;
    if (!job) throw new AppError('not_found', 'That job does not exist.');
    if (job.status !== 'failed') throw new AppError('conflict', 'Only a failed job can be retried; this one is not failed.');
    await job.update({ status: 'queued', attempts: 0, runAfter: new Date(), finishedAt: null, lockedBy: null, lockedUntil: null }, { transaction });
    return jobDto(job);
  });
}
