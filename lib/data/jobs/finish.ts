import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@/models';
import { retryDelayMs, type RetryPolicy } from '../../jobs/backoff';

/**
 * The end of an attempt. Both writes are fenced by the lock: they change the row only while it is
 * still `running` and held by this worker, so a worker whose lock expired (and whose job another
 * worker has since taken) cannot overwrite the newer attempt.
 */

const MAX_ERROR_CHARS = 1000;

/** Marks the job done inside the caller's transaction; false when this worker no longer holds it. */
export async function markJobDone(jobId: number, workerId: string, transaction: Transaction): Promise<boolean> {
  const [, affected] = await sequelize.query(
    `UPDATE jobs SET status = 'done', locked_by = NULL, locked_until = NULL, finished_at = UTC_TIMESTAMP(3), updated_at = UTC_TIMESTAMP(3)
     WHERE id = ? AND status = 'running' AND locked_by = ?`,
    { type: QueryTypes.UPDATE, transaction, replacements: [jobId, workerId] },
  );
  return Number(affected) === 1;
}

/**
 * Records a failed attempt: queued again after the back-off for `attempts` failures, or failed for
 * good when the attempts are used up or `permanent` (retrying cannot help, e.g. a malformed payload).
 */
export async function markJobFailed(
  job: { id: number; attempts: number; maxAttempts: number },
  workerId: string,
  message: string,
  options: { policy: RetryPolicy; permanent?: boolean },
): Promise<'queued' | 'failed' | 'lost'> {
  const final = options.permanent === true || job.attempts >= job.maxAttempts;
  const delayUs = final ? 0 : retryDelayMs(Math.max(1, job.attempts), options.policy) * 1000;
  const [, affected] = await sequelize.query(
    `UPDATE jobs SET status = ?, last_error = ?, locked_by = NULL, locked_until = NULL,
       run_after = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND, finished_at = ${final ? 'UTC_TIMESTAMP(3)' : 'NULL'}, updated_at = UTC_TIMESTAMP(3)
     WHERE id = ? AND status = 'running' AND locked_by = ?`,
    { type: QueryTypes.UPDATE, replacements: [final ? 'failed' : 'queued', message.slice(0, MAX_ERROR_CHARS), delayUs, job.id, workerId] },
  );
  if (Number(affected) !== 1) return 'lost';
  return final ? 'failed' : 'queued';
}
