import 'server-only';
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/models';
import { MAX_REFRESHER_LEAD_DAYS, daysBefore, refresherDedupeKey, refresherIsDue } from '../../qualification/refresher';
import { enqueueJob } from '../jobs/enqueue';

/**
 * The periodic scan: one `refresher_reminder` job per live record of training whose reminder is due
 * (its cohort's lead time before valid-until has come, not yet expired, none sent for that date).
 * Revoked and replaced records and deactivated accounts are left out. Enqueueing is idempotent by
 * record and valid-until date, so scans on several instances, or again the next hour, add nothing.
 * Answers the number of jobs it added.
 */
export async function scanRefresherReminders(now = new Date()): Promise<number> {
  const today = now.toISOString().slice(0, 10);
  const candidates = await sequelize.query<{ id: number; valid_until: string; lead_days: number }>(
    `SELECT tr.id, DATE_FORMAT(tr.valid_until, '%Y-%m-%d') AS valid_until, c.refresher_lead_days AS lead_days
     FROM training_records tr
     JOIN cohorts c ON c.id = tr.cohort_id
     JOIN users u ON u.id = tr.user_id
     WHERE tr.revoked_at IS NULL AND tr.replaced_by_id IS NULL AND u.is_active = 1
       AND tr.valid_until BETWEEN ? AND ?
       AND NOT EXISTS (SELECT 1 FROM refresher_reminders rr WHERE rr.training_record_id = tr.id AND rr.valid_until = tr.valid_until)
     ORDER BY tr.valid_until, tr.id`,
    // A coarse window in SQL (the longest lead time); refresherIsDue decides per cohort.
    { type: QueryTypes.SELECT, replacements: [today, daysBefore(today, -MAX_REFRESHER_LEAD_DAYS)] },
  );
  let added = 0;
  for (const row of candidates) {
    const validUntil = row.valid_until;
    if (!refresherIsDue(validUntil, Number(row.lead_days), today)) continue;
    const trainingRecordId = Number(row.id);
    const { created } = await enqueueJob('refresher_reminder', { trainingRecordId, validUntil }, { dedupeKey: refresherDedupeKey(trainingRecordId, validUntil), runAfter: now });
    if (created) added += 1;
  }
  return added;
}
