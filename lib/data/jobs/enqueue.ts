import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@/models';
import { parseJobPayload, type JobKind, type JobPayload } from '../../jobs/job-kinds';

export interface EnqueueOptions {
  /** Unique per piece of work: enqueueing the same key again adds nothing and answers the existing job. */
  dedupeKey: string;
  runAfter?: Date;
  maxAttempts?: number;
  transaction?: Transaction;
}

/**
 * Adds a job unless one with the same dedupe key exists (idempotent, also when two instances enqueue
 * at once: the unique index settles it in one statement). The payload is checked against its kind.
 * A raw `INSERT … ON DUPLICATE KEY UPDATE` on purpose: a find-then-create would race.
 */
export async function enqueueJob<K extends JobKind>(kind: K, payload: JobPayload<K>, options: EnqueueOptions): Promise<{ id: number; created: boolean }> {
  const checked = parseJobPayload(kind, payload);
  const now = new Date();
  const [, affected] = await sequelize.query(
    `INSERT INTO jobs (kind, payload, dedupe_key, status, run_after, attempts, max_attempts, created_at, updated_at)
     VALUES (?, ?, ?, 'queued', ?, 0, ?, ?, ?) ON DUPLICATE KEY UPDATE id = id`,
    { type: QueryTypes.INSERT, transaction: options.transaction, replacements: [kind, JSON.stringify(checked), options.dedupeKey, options.runAfter ?? now, options.maxAttempts ?? 8, now, now] },
  );
  const [row] = await sequelize.query<{ id: number }>('SELECT id FROM jobs WHERE dedupe_key = ?', { type: QueryTypes.SELECT, transaction: options.transaction, replacements: [options.dedupeKey] });
  return { id: Number(row!.id), created: Number(affected) === 1 };
}
