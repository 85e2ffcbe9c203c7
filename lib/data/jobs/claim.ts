import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { Job, sequelize } from '@/models';
import { retryDelayMs, type RetryPolicy } from '../../jobs/backoff';

/**
 * Claiming and recovering jobs. Every instance may run a worker: a claim reads due rows with
 * `SELECT … FOR UPDATE SKIP LOCKED` (MariaDB 10.6 and later; Debian 12 ships 10.11) inside a
 * transaction, so two workers never take the same row (each skips the rows the other holds) and
 * neither waits for the other. Times are the database's clock (UTC_TIMESTAMP), so instances whose
 * clocks differ still agree on what is due and when a lock ends.
 */

const ids = (rows: { id: number }[]) => rows.map((row) => Number(row.id));

/** Takes up to `limit` due queued jobs for `workerId`: running, one more attempt counted, locked for `lockMs`. */
export async function claimJobs(workerId: string, options: { limit: number; lockMs: number }): Promise<Job[]> {
  return sequelize.transaction(async (transaction) => {
    const due = ids(await sequelize.query<{ id: number }>(
      `SELECT id FROM jobs WHERE status = 'queued' AND run_after <= UTC_TIMESTAMP(3)
       ORDER BY run_after, id LIMIT ? FOR UPDATE SKIP LOCKED`,
      { type: QueryTypes.SELECT, transaction, replacements: [options.limit] },
    ));
    if (!due.length) return [];
    await sequelize.query(
      `UPDATE jobs SET status = 'running', attempts = attempts + 1, locked_by = ?,
         locked_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND, updated_at = UTC_TIMESTAMP(3) WHERE id IN (?)`,
      { transaction, replacements: [workerId, options.lockMs * 1000, due] },
    );
    return Job.findAll({ where: { id: { [Op.in]: due } }, order: [['id', 'ASC']], transaction });
  });
}

/** The note a recovered job carries: its worker stopped (or lost the database) before finishing. */
export const LOCK_EXPIRED_NOTE = 'The worker that took this job stopped before finishing it; it was put back in the queue.';

/**
 * Puts back jobs whose lock has expired (their worker died or hung): queued again after the back-off
 * for the attempts they have used, or failed when none are left. Rows another worker is recovering
 * at the same moment are skipped, as in a claim. Answers how many were recovered.
 */
export async function recoverExpiredJobs(policy: RetryPolicy): Promise<number> {
  return sequelize.transaction(async (transaction) => {
    const expired = await sequelize.query<{ id: number; attempts: number; max_attempts: number }>(
      `SELECT id, attempts, max_attempts FROM jobs WHERE status = 'running' AND locked_until < UTC_TIMESTAMP(3)
       ORDER BY locked_until LIMIT 100 FOR UPDATE SKIP LOCKED`,
      { type: QueryTypes.SELECT, transaction },
    );
    for (const row of expired) {
      const exhausted = Number(row.attempts) >= Number(row.max_attempts);
      await sequelize.query(
        `UPDATE jobs SET status = ?, last_error = ?, locked_by = NULL, locked_until = NULL,
           run_after = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND, finished_at = ?, updated_at = UTC_TIMESTAMP(3) WHERE id = ?`,
        {
          transaction,
          replacements: [exhausted ? 'failed' : 'queued', LOCK_EXPIRED_NOTE, exhausted ? 0 : retryDelayMs(Math.max(1, Number(row.attempts)), policy) * 1000, exhausted ? new Date() : null, row.id],
        },
      );
    }
    return expired.length;
  });
}
