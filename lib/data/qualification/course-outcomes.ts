import 'server-only';
import { z } from 'zod';
import type { Transaction } from 'sequelize';
import { Cohort, CohortMember, CourseOutcome, User, sequelize } from '@/models';
import { AppError } from '../../http/errors';
import type { SessionUser } from '../../auth/session';
import { manageableCohort } from '../cohort-access';
import { writeAudit } from '../audit-log';
import { nextVersion } from '../optimistic-lock';
import { parseFields } from '../../http/server-action';
import { DEFAULT_RECORD_VALIDITY_MONTHS, MAX_RECORD_VALIDITY_MONTHS } from '../../qualification/training-record';
import { DEFAULT_REFRESHER_LEAD_DAYS, MAX_REFRESHER_LEAD_DAYS } from '../../qualification/refresher';

export interface CourseOutcomeDto {
  id: number;
  decision: 'pass' | 'not_yet';
  scopes: string[];
  decidedByName: string;
  decidedAt: string;
  version: number;
}

const decisionSchema = z.object({
  decision: z.enum(['pass', 'not_yet'], { error: 'Choose pass or not yet.' }),
  scopes: z.array(z.string().trim().min(1).max(60)).max(10),
});

export const outcomeDto = (row: CourseOutcome): CourseOutcomeDto => ({
  id: Number(row.id),
  decision: row.decision === 'pass' ? 'pass' : 'not_yet',
  scopes: JSON.parse(row.scopes) as string[],
  decidedByName: row.decidedByName,
  decidedAt: row.decidedAt.toISOString(),
  version: row.version,
});

/** The trainee, when they are a member of the cohort; else 404 (nothing about who exists). */
export async function cohortTrainee(cohortId: number, traineeId: number, transaction?: Transaction): Promise<User> {
  const member = Number.isInteger(traineeId) ? await CohortMember.findOne({ where: { cohortId, userId: traineeId }, transaction }) : null;
  const trainee = member ? await User.findByPk(traineeId, { transaction }) : null;
  if (!trainee) throw new AppError('not_found', 'That person is not a member of this cohort.');
  return trainee;
}

export async function courseOutcomeOf(cohortId: number, traineeId: number): Promise<CourseOutcomeDto | null> {
  const row = await CourseOutcome.findOne({ where: { cohortId, userId: traineeId } });
  return row ? outcomeDto(row) : null;
}

/**
 * The instructor's decision for one trainee (pass or not yet) with the scopes it covers; a pass needs
 * at least one scope. Edited through a form, so it carries a version (optimistic locking); every
 * change is written to the audit log in the same transaction.
 */
export async function decideCourseOutcome(user: SessionUser | null, cohortId: number, traineeId: number, input: unknown, sentVersion: unknown): Promise<CourseOutcomeDto> {
  const cohort = await manageableCohort(user, cohortId);
  const data = parseFields(decisionSchema, input, 'The decision could not be saved; check the fields marked.');
  if (data.decision === 'pass' && data.scopes.length === 0) throw new AppError('invalid_input', 'A pass needs at least one scope.', { field: 'scopes' });
  await cohortTrainee(cohort.id, traineeId);
  return sequelize.transaction(async (transaction) => {
    await Cohort.findByPk(cohort.id, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
    const row = await CourseOutcome.findOne({ where: { cohortId: cohort.id, userId: traineeId }, transaction, lock: transaction.LOCK.UPDATE });
    const version = nextVersion(row?.version ?? 0, sentVersion);
    const values = { decision: data.decision, scopes: JSON.stringify(data.scopes), decidedById: user!.id, decidedByName: user!.name, decidedAt: new Date(), version };
    const before = row ? { decision: row.decision, scopes: JSON.parse(row.scopes) as unknown } : null;
    const saved = row ? await row.update(values, { transaction }) : await CourseOutcome.create({ cohortId: cohort.id, userId: traineeId, ...values }, { transaction });
    await writeAudit(transaction, user, { objectType: 'course_outcome', objectId: Number(saved.id), action: row ? 'update' : 'create', before, after: { decision: data.decision, scopes: data.scopes } });
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
