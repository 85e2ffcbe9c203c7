import 'server-only';
import type { JobKind, JobPayload } from '../../jobs/job-kinds';
import { scanRefresherReminders } from '../reminders/refresher-scan';
import { sendRefresherReminder } from '../reminders/refresher-mail';
import type { JobContext } from './job-context';

export type JobHandler<K extends JobKind> = (payload: JobPayload<K>, context: JobContext) => Promise<void>;

/** One handler per kind; a handler that returns without calling `markDone` is marked done by the worker. */
export const JOB_HANDLERS: { [K in JobKind]: JobHandler<K> } = {
  refresher_scan: async () => {
    await scanRefresherReminders();
  },
  refresher_reminder: sendRefresherReminder,
};

/**
 * Jobs every worker makes sure exist: the refresher scan once per hour (UTC). The dedupe key is the
 * hour, so however many instances run, one scan per hour is queued and one worker runs it.
 */
export function periodicJobs(now: Date) {
  const hour = now.toISOString().slice(0, 13);
  return [{ kind: 'refresher_scan' as const, payload: { hour }, dedupeKey: `refresher_scan:${hour}` }];
}
