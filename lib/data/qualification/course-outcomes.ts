import 'server-only';
import { z } from 'zod';
import { Cohort, CourseOutcome, sequelize } from '@/models';
import { AppError } from '../../http/errors';
import type { SessionUser } from '../../auth/session';
import { manageableCohort } from '../cohort-access';
import { writeAudit } from '../audit-log';
import { nextVersion } from '../optimistic-lock';
import { parseFields } from '../../http/server-action';
import { cohortTrainee } from './cohort-trainee';
import { courseEvidenceOf } from './course-evidence';
import { overrideReasonSchema } from '../../qualification/course-evidence-input';
import { DEFAULT_RECORD_VALIDITY_MONTHS, MAX_RECORD_VALIDITY_MONTHS } from '../../qualification/training-record';
import { DEFAULT_REFRESHER_LEAD_DAYS, MAX_REFRESHER_LEAD_DAYS } from '../../qualification/refresher';

export interface CourseOutcomeDto {
  id: number;
  decision: 'pass' | 'not_yet';
  scopes: string[];
  decidedByName: string;
  decidedAt: string;
  version: number;
  /** Why a pass was recorded with something outstanding; null when nothing was. */
  overrideReason: string | null;
}

const decisionSchema = z.object({
  decision: z.enum(['pass', 'not_yet'], { error: 'Choose pass or not yet.' }),
  scopes: z.array(z.string().trim().min(1).max(60)).max(10),
  overrideReason: z.string().trim().max(400, 'At most 400 characters.').optional(),
});

export const outcomeDto = (row: CourseOutcome): CourseOutcomeDto => ({
  id: Number(row.id),
  decision: row.decision === 'pass' ? 'pass' : 'not_yet',
  scopes: JSON.parse(row.scopes) as string[],
  decidedByName: row.decidedByName,
  decidedAt: row.decidedAt.toISOString(),
  version: row.version,
  overrideReason: row.overrideReason ?? null,
});

export async function courseOutcomeOf(cohortId: number, traineeId: number): Promise<CourseOutcomeDto | null> {
  const row = await CourseOutcome.findOne({ where: { cohortId, userId: traineeId } });
  return row ? outcomeDto(row) : null;
}

/**
 * The instructor's decision for one trainee (pass or not yet) with the scopes it covers; a pass needs
 * at least one scope. The rule for a pass with something outstanding (no met attempt, the theory
 * result missing or below the pass mark, checklist items not observed): it is recorded only with an
 * explicit override reason (3–400 characters), stored on the outcome and in the audit row; without
 * one it is refused (422) and nothing changes. The evidence is read under the cohort's lock, the
 * same lock every change of it takes. Edited through a form, so it carries a version (optimistic
 * locking); every change is written to the audit log in the same transaction.
 */
export async function decideCourseOutcome(user: SessionUser | null, cohortId: number, traineeId: number, input: unknown, sentVersion: unknown): Promise<CourseOutcomeDto> {
  const cohort = await manageableCohort(user, cohortId);
  const data = parseFields(decisionSchema, input, 'The decision could not be saved; check the fields marked.');
  if (data.decision === 'pass' && data.scopes.length === 0) throw new AppError('invalid_input', 'A pass needs at least one scope.', { field: 'scopes' });
  await cohortTrainee(cohort.id, traineeId);
  return sequelize.transaction(async (transaction) => {
    const locked = (await Cohort.findByPk(cohort.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const outstanding = data.decision === 'pass' ? (await courseEvidenceOf(locked, traineeId, transaction)).outstanding : [];
    let overrideReason: string | null = null;
    if (outstanding.length) {
      const reason = overrideReasonSchema.safeParse(data.overrideReason ?? '');
      if (!reason.success) {
        const message = `Outstanding: ${outstanding.join(' ')} To record a pass anyway, give the reason for the override; otherwise record "not yet".`;
        throw new AppError('invalid_input', message, { fieldErrors: { overrideReason: [reason.error.issues[0]!.message] } });
      }
      overrideReason = reason.data;
    }
    const row = await CourseOutcome.findOne({ where: { cohortId: cohort.id, userId: traineeId }, transaction, lock: transaction.LOCK.UPDATE });
    const version = nextVersion(row?.version ?? 0, sentVersion);
    const values = { decision: data.decision, scopes: JSON.stringify(data.scopes), decidedById: user!.id, decidedByName: user!.name, decidedAt: new Date(), version, overrideReason };
    const before = row ? { decision: row.decision, scopes: JSON.parse(row.scopes) as unknown, overrideReason: row.overrideReason ?? null } : null;
    const saved = row ? await row.update(values, { transaction }) : await CourseOutcome.create({ cohortId: cohort.id, userId: traineeId, ...values }, { transaction });
    await writeAudit(transaction, user, {
      objectType: 'course_outcome',
      objectId: Number(saved.id),
      action: overrideReason ? 'pass_override' : row ? 'update' : 'create',
      reason: overrideReason,
      before,
      after: { decision: data.decision, scopes: data.scopes, overrideReason, outstanding },
    });
    return outcomeDto(saved);
  });
}

const validitySchema = z.object({
  months: z.coerce.number({ error: 'Enter a whole number of months.' }).int('Enter a whole number of months.').min(1, 'At least 1 month.').max(MAX_RECORD_VALIDITY_MONTHS, `At most ${MAX_RECORD_VALIDITY_MONTHS} months.`),
  /** Left out: the cohort keeps its lead time. */
  leadDays: z.coerce.number({ error: 'Enter a whole number of days.' }).int('Enter a whole number of days.').min(0, 'At least 0 days.').max(MAX_REFRESHER_LEAD_DAYS, `At most ${MAX_REFRESHER_LEAD_DAYS} days.`).optional(),
});

/**
 * How long the cohort's records of training are valid and how many days before the end their
 * refresher reminder goes out; records already issued keep their dates (a reminder not yet queued
 * follows the new lead time).
 */
export async function setRecordValidity(user: SessionUser | null, cohortId: number, input: unknown): Promise<{ months: number; leadDays: number }> {
  const cohort = await manageableCohort(user, cohortId);
  const { months, leadDays } = parseFields(validitySchema, input, 'The validity could not be saved.');
  return sequelize.transaction(async (transaction) => {
    const row = await Cohort.findByPk(cohort.id, { transaction, lock: transaction.LOCK.UPDATE });
    const before = { recordValidityMonths: row?.recordValidityMonths ?? DEFAULT_RECORD_VALIDITY_MONTHS, refresherLeadDays: row?.refresherLeadDays ?? DEFAULT_REFRESHER_LEAD_DAYS };
    const after = { recordValidityMonths: months, refresherLeadDays: leadDays ?? before.refresherLeadDays };
    await Cohort.update(after, { where: { id: cohort.id }, transaction });
    await writeAudit(transaction, user, { objectType: 'criteria', objectId: cohort.id, action: 'record_validity', before, after });
    return { months, leadDays: after.refresherLeadDays };
  });
}
