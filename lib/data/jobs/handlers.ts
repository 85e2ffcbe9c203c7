import 'server-only';
import type { JobKind, JobPayload } from '../../jobs/job-kinds';
import { scanRefresherReminders } from '../reminders/refresher-scan';
import { sendRefresherReminder } from '../reminders/refresher-mail';
import type { JobContext } from './job-context';
import { purgeFinishedJobs } from './purge';

export type JobHandler<K extends JobKind> = (payload: JobPayload<K>, context: JobContext) => Promise<void>;

/** One handler per kind; a handler that returns without calling `markDone` is marked done by the worker. */
export const JOB_HANDLERS: { [K in JobKind]: JobHandler<K> } = {
  refresher_scan: async () => {
    await scanRefresherReminders();
  },
  refresher_reminder: sendRefresherReminder,
  purge_finished_jobs: async () => {
    await purgeFinishedJobs();
  },
};

/**
 * Jobs every worker makes sure exist: the refresher scan once per hour and the clean-up once per day
 * (UTC). The dedupe key is the hour or day, so however many instances run, one of each is queued and
 * one worker runs it.
 */
export function periodicJobs(now: Date) {
  const hour = now.toISOString().slice(0, 13);
  const day = now.toISOString().slice(0, 10);
  return [
    { kind: 'refresher_scan' as const, payload: { hour }, dedupeKey: `refresher_scan:${hour}` },
    { kind: 'purge_finished_jobs' as const, payload: { day }, dedupeKey: `purge_finished_jobs:${day}` },
  ];
}
