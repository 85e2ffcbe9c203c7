import 'server-only';
import { readFile } from 'node:fs/promises';
import { z } from 'zod';
import { Cohort, CourseOutcome, TrainingRecord, sequelize } from '@/models';
import { AppError } from '../../http/errors';
import { assertRole, type SessionUser } from '../../auth/session';
import { appBaseUrl } from '../../platform/env';
import { manageableCohort } from '../cohort-access';
import { auditHistory, writeAudit, type AuditEntryDto } from '../audit-log';
import { courseOutcomeOf, type CourseOutcomeDto } from './course-outcomes';
import { cohortTrainee } from './cohort-trainee';
import { courseEvidenceOf, type CourseEvidenceDto } from './course-evidence';
import { addMonths, recordStatus, type RecordStatus } from '../../qualification/training-record';
import { newVerificationCode } from '../../qualification/verification-code';
import { recordOfTrainingPdf, type Paper, type RecordFonts } from '../../qualification/record-pdf';

export interface TrainingRecordDto {
  id: number;
  code: string;
  traineeName: string;
  courseName: string;
  scope: string;
  issuedOn: string;
  validUntil: string;
  issuedByName: string;
  status: RecordStatus;
  revokeReason: string | null;
}

const today = (now = new Date()) => now.toISOString().slice(0, 10);

export const recordDto = (row: TrainingRecord, now = new Date()): TrainingRecordDto => ({
  id: Number(row.id),
  code: row.code,
  traineeName: row.traineeName,
  courseName: row.courseName,
  scope: row.scope,
  issuedOn: row.issuedOn,
  validUntil: row.validUntil,
  issuedByName: row.issuedByName,
  status: recordStatus({ revokedAt: row.revokedAt?.toISOString() ?? null, replacedById: row.replacedById, validUntil: row.validUntil }, today(now)),
  revokeReason: row.revokeReason,
});

/** The address printed on the record and drawn as its QR code. */
export const verifyUrlOf = (code: string) => `${appBaseUrl()}/verify/${code}`;

export interface TraineeQualification {
  outcome: CourseOutcomeDto | null;
  records: TrainingRecordDto[];
  validityMonths: number;
  refresherLeadDays: number;
  evidence: CourseEvidenceDto;
  history: AuditEntryDto[];
}

/** The trainee sheet's outcome, records (newest first), the cohort's validity and their history. */
export async function traineeQualification(user: SessionUser | null, cohortId: number, traineeId: number): Promise<TraineeQualification> {
  const cohort = await manageableCohort(user, cohortId);
  await cohortTrainee(cohort.id, traineeId);
  const outcome = await courseOutcomeOf(cohort.id, traineeId);
  const rows = await TrainingRecord.findAll({ where: { cohortId: cohort.id, userId: traineeId }, order: [['id', 'DESC']] });
  const evidence = await courseEvidenceOf(cohort, traineeId);
  const objects = [
    ...(outcome ? [{ objectType: 'course_outcome' as const, objectId: outcome.id }] : []),
    ...rows.map((row) => ({ objectType: 'training_record' as const, objectId: Number(row.id) })),
    ...(evidence.theory ? [{ objectType: 'theory_result' as const, objectId: evidence.theory.id }] : []),
    ...evidence.checklist.flatMap((entry) => (entry.tick ? [{ objectType: 'checklist_tick' as const, objectId: entry.tick.id }] : [])),
  ];
  return { outcome, records: rows.map((row) => recordDto(row)), validityMonths: cohort.recordValidityMonths, refresherLeadDays: cohort.refresherLeadDays, evidence, history: await auditHistory(user!, objects) };
}

/** The signed-in trainee's own records, newest first (Progress). */
export async function myTrainingRecords(user: SessionUser | null): Promise<TrainingRecordDto[]> {
  assertRole(user, ['trainee', 'instructor', 'researcher', 'admin']);
  const rows = await TrainingRecord.findAll({ where: { userId: user.id }, order: [['id', 'DESC']] });
  return rows.map((row) => recordDto(row));
}

/** Inside the caller's transaction: a new record from the trainee's pass, valid for the cohort's months from today. */
async function createRecord(user: SessionUser, cohort: Cohort, traineeId: number, transaction: Parameters<typeof writeAudit>[0], now: Date): Promise<TrainingRecord> {
  const outcome = await CourseOutcome.findOne({ where: { cohortId: cohort.id, userId: traineeId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!outcome || outcome.decision !== 'pass') throw new AppError('invalid_input', 'Only a trainee whose course outcome is a pass can be given a record of training.');
  const trainee = await cohortTrainee(cohort.id, traineeId, transaction);
  const issuedOn = today(now);
  const record = await TrainingRecord.create(
    {
      code: newVerificationCode(),
      cohortId: cohort.id,
      userId: traineeId,
      traineeName: trainee.name,
      courseName: cohort.name,
      scope: (JSON.parse(outcome.scopes) as string[]).join(', '),
      issuedOn,
      validUntil: addMonths(issuedOn, cohort.recordValidityMonths),
      issuedById: user.id,
      issuedByName: user.name,
      revokedAt: null,
      revokeReason: null,
      replacedById: null,
      createdAt: now,
    },
    { transaction },
  );
  await writeAudit(transaction, user, { objectType: 'training_record', objectId: Number(record.id), action: 'issue', after: { code: record.code, scope: record.scope, issuedOn, validUntil: record.validUntil } });
  return record;
}

/** Issues the record of training for a trainee who passed; one record in force at a time (reissue replaces it). */
export async function issueTrainingRecord(user: SessionUser | null, cohortId: number, traineeId: number, now = new Date()): Promise<TrainingRecordDto> {
  const cohort = await manageableCohort(user, cohortId);
  return sequelize.transaction(async (transaction) => {
    const locked = (await Cohort.findByPk(cohort.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
    const live = await TrainingRecord.count({ where: { cohortId: cohort.id, userId: traineeId, revokedAt: null }, transaction });
    if (live > 0) throw new AppError('conflict', 'This trainee already has a record of training from this cohort. Reissue it to replace it.');
    return recordDto(await createRecord(user!, locked, traineeId, transaction, now), now);
  });
}

const reasonSchema = z.string().trim().min(3, 'Give a reason of at least 3 characters.').max(400, 'At most 400 characters.');

/** The record and its cohort, locked, when this person manages the cohort; 404 otherwise. */
async function manageableRecord(user: SessionUser | null, recordId: number, transaction: Parameters<typeof writeAudit>[0]) {
  assertRole(user, ['instructor', 'admin']);
  const record = Number.isInteger(recordId) ? await TrainingRecord.findByPk(recordId, { transaction, lock: transaction.LOCK.UPDATE }) : null;
  if (!record) throw new AppError('not_found', 'That record of training does not exist.');
  const cohort = await manageableCohort(user, record.cohortId);
  if (record.revokedAt !== null) throw new AppError('conflict', 'This record has already been revoked.');
  return { record, cohort };
}

/** Revokes a record with a reason; the verify page then says "revoked". */
export async function revokeTrainingRecord(user: SessionUser | null, recordId: number, rawReason: unknown, now = new Date()): Promise<TrainingRecordDto> {
  const parsed = reasonSchema.safeParse(rawReason);
  if (!parsed.success) throw new AppError('invalid_input', parsed.error.issues[0]!.message, { field: 'reason' });
  return sequelize.transaction(async (transaction) => {
    const { record } = await manageableRecord(user, recordId, transaction);
    await record.update({ revokedAt: now, revokeReason: parsed.data }, { transaction });
    await writeAudit(transaction, user, { objectType: 'training_record', objectId: Number(record.id), action: 'revoke', reason: parsed.data, before: { status: 'valid' }, after: { status: 'revoked' } });
    return recordDto(record, now);
  });
}

/** A new record (new code, dates from today) replacing this one; the old code then shows as revoked, replaced. */
export async function reissueTrainingRecord(user: SessionUser | null, recordId: number, now = new Date()): Promise<TrainingRecordDto> {
  return sequelize.transaction(async (transaction) => {
    const { record, cohort } = await manageableRecord(user, recordId, transaction);
    const fresh = await createRecord(user!, cohort, record.userId, transaction, now);
    const reason = 'Replaced by a reissued record';
    await record.update({ revokedAt: now, revokeReason: reason, replacedById: Number(fresh.id) }, { transaction });
    await writeAudit(transaction, user, { objectType: 'training_record', objectId: Number(record.id), action: 'replace', reason, after: { replacedBy: fresh.code } });
    return recordDto(fresh, now);
  });
}

/** DejaVu Sans (Debian's fonts-dejavu-core; free licence), embedded in every record. */
const FONT_DIR = process.env.EVENLOAD_FONT_DIR ?? '/usr/share/fonts/truetype/dejavu';
let fonts: Promise<RecordFonts> | null = null;
function recordFonts(): Promise<RecordFonts> {
  fonts ??= Promise.all([readFile(`${FONT_DIR}/DejaVuSans.ttf`), readFile(`${FONT_DIR}/DejaVuSans-Bold.ttf`)])
    .then(([regular, bold]) => ({ regular, bold }))
    .catch((error: unknown) => {
      fonts = null;
      console.error('[records] fonts missing (install fonts-dejavu-core)', error);
      throw new AppError('unavailable', 'Records of training cannot be made on this server at the moment.');
    });
  return fonts;
}

/**
 * The record as a PDF, for the cohort's instructor, an admin, or the trainee it names. Paper: the
 * choice, else the person's units (US customary → Letter, SI → A4).
 */
export async function trainingRecordPdf(user: SessionUser | null, recordId: number, paper?: Paper): Promise<{ bytes: Uint8Array; fileName: string }> {
  assertRole(user, ['trainee', 'instructor', 'admin']);
  const record = Number.isInteger(recordId) ? await TrainingRecord.findByPk(recordId) : null;
  if (!record) throw new AppError('not_found', 'That record of training does not exist.');
  if (record.userId !== user.id) await manageableCohort(user, record.cohortId);
  const cohort = (await Cohort.findByPk(record.cohortId))!;
  const bytes = await recordOfTrainingPdf(
    { ...record.get({ plain: true }), site: cohort.site, verifyUrl: verifyUrlOf(record.code) },
    paper ?? (user.units === 'us' ? 'letter' : 'a4'),
    await recordFonts(),
  );
  return { bytes, fileName: `record-of-training-${record.code}.pdf` };
}
