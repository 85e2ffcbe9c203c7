import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { RefresherReminder, TrainingRecord, User, sequelize } from '@/models';
import { appBaseUrl } from '../../platform/env';
import { refresherMail } from '../../mail/templates';
import type { JobPayload } from '../../jobs/job-kinds';
import type { JobContext } from '../jobs/job-context';

/** The fixed Message-ID of one record's reminder for one valid-until date (the same on every attempt). */
export function refresherMessageId(trainingRecordId: number, validUntil: string): string {
  return `<refresher-${trainingRecordId}-${validUntil}@${new URL(appBaseUrl()).hostname}>`;
}

/**
 * Sends one refresher reminder, once. Before sending it looks for the `refresher_reminders` row of
 * this record and date: when there is one, the mail went out on an earlier attempt and nothing is
 * sent again. After the SMTP server has accepted the message, that row and the job's `done` are
 * written in one transaction. A record revoked, replaced or given new dates since the scan, or a
 * deactivated account, gets nothing (the job ends done). See DEVELOPERS.md "Jobs" for the guarantee.
 */
export async function sendRefresherReminder(payload: JobPayload<'refresher_reminder'>, context: JobContext): Promise<void> {
  const { trainingRecordId, validUntil } = payload;
  if (await RefresherReminder.findOne({ where: { trainingRecordId, validUntil } })) return;
  const record = await TrainingRecord.findByPk(trainingRecordId);
  if (!record || record.revokedAt !== null || record.replacedById !== null || record.validUntil !== validUntil) return;
  const trainee = await User.findByPk(record.userId, { attributes: ['id', 'email', 'isActive'] });
  if (!trainee?.isActive) return;

  const messageId = refresherMessageId(trainingRecordId, validUntil);
  const content = refresherMail({
    traineeName: record.traineeName,
    courseName: record.courseName,
    scope: record.scope,
    validUntil,
    verifyLink: `${appBaseUrl()}/verify/${record.code}`,
    progressLink: `${appBaseUrl()}/progress`,
  });
  await context.sendMail({ to: trainee.email, ...content, messageId });
  try {
    await sequelize.transaction(async (transaction) => {
      await RefresherReminder.create({ trainingRecordId, validUntil, jobId: context.jobId, sentTo: trainee.email, messageId, sentAt: new Date() }, { transaction });
      await context.markDone(transaction);
    });
  } catch (error) {
    // Another attempt recorded the same reminder first (only possible after a lock expired mid-send).
    if (!(error instanceof UniqueConstraintError)) throw error;
    await sequelize.transaction((transaction) => context.markDone(transaction));
  }
}
