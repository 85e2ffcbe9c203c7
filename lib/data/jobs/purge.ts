import 'server-only';
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/models';
import { FINISHED_JOBS_KEPT_DAYS } from '../../jobs/job-kinds';

/**
 * Removes done jobs finished more than FINISHED_JOBS_KEPT_DAYS ago, so the hourly scans do not pile
 * up. A sent reminder stays known through `refresher_reminders`, so the scan never queues it again.
 * Failed jobs stay until an admin retries them. Answers how many were removed.
 */
export async function purgeFinishedJobs(): Promise<number> {
  const affected = await sequelize.query(
    "DELETE FROM jobs WHERE status = 'done' AND finished_at < UTC_TIMESTAMP(3) - INTERVAL ? DAY",
    { type: QueryTypes.BULKDELETE, replacements: [FINISHED_JOBS_KEPT_DAYS] },
  );
  return Number(affected ?? 0);
}
