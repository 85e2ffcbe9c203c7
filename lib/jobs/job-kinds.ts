import { z } from 'zod';
import { isoDateSchema } from '../validation/iso-date';

/**
 * The kinds of background job and the payload each carries, checked with zod when a job is
 * enqueued and again when it runs (a payload is data from the database, a boundary like any other).
 */
export const JOB_PAYLOADS = {
  /** Looks for records of training whose refresher reminder is due and enqueues one reminder each. */
  refresher_scan: z.object({ hour: z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}$/) }).strict(),
  /** Mails the trainee named on one record of training that its valid-until date is near. */
  refresher_reminder: z.object({ trainingRecordId: z.number().int().positive(), validUntil: isoDateSchema() }).strict(),
  /** Removes done jobs finished more than `FINISHED_JOBS_KEPT_DAYS` ago (once a day). */
  purge_finished_jobs: z.object({ day: isoDateSchema() }).strict(),
} as const;

/** Done jobs are kept this long for the admin's list, then removed; failed ones stay until retried. */
export const FINISHED_JOBS_KEPT_DAYS = 30;

export type JobKind = keyof typeof JOB_PAYLOADS;
export type JobPayload<K extends JobKind> = z.infer<(typeof JOB_PAYLOADS)[K]>;
export const JOB_KINDS = Object.keys(JOB_PAYLOADS) as JobKind[];

export const JOB_KIND_LABEL: Record<JobKind, string> = {
  refresher_scan: 'Look for refresher reminders due',
  refresher_reminder: 'Refresher reminder',
  purge_finished_jobs: 'Clear old finished jobs',
};

export const isJobKind = (kind: string): kind is JobKind => Object.hasOwn(JOB_PAYLOADS, kind);

/** The payload checked against its kind's schema. @throws ZodError when it does not match. */
export function parseJobPayload<K extends JobKind>(kind: K, payload: unknown): JobPayload<K> {
  return JOB_PAYLOADS[kind].parse(payload) as JobPayload<K>;
}
