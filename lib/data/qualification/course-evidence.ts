import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { ChecklistItem, ChecklistTick, Cohort, TheoryResult, sequelize } from '@/models';
import { AppError } from '../../http/errors';
import type { SessionUser } from '../../auth/session';
import { parseFields } from '../../http/server-action';
import { manageableCohort } from '../cohort-access';
import { writeAudit } from '../audit-log';
import { nextVersion } from '../optimistic-lock';
import { cohortTrainee } from './cohort-trainee';
import { DEFAULT_THEORY_PASS_MARK, outstandingItems, theoryPassed } from '../../qualification/course-outcome';
import { checklistSchema, passMarkSchema, theoryResultSchema, tickSchema } from '../../qualification/course-evidence-input';

export interface TheoryResultDto {
  id: number;
  scorePercent: number;
  takenOn: string;
  enteredByName: string;
  enteredAt: string;
  passed: boolean;
  /** Sent back by the form (optimistic lock). */
  version: number;
}

export interface ChecklistTickDto {
  id: number;
  observed: boolean;
  byName: string;
  at: string;
  note: string | null;
  /** Sent back by the tick's form (optimistic lock). */
  version: number;
}

export interface ChecklistEntryDto {
  id: number;
  label: string;
  retired: boolean;
  tick: ChecklistTickDto | null;
}

/** Everything that stands behind one trainee's decision in one cohort, and what is outstanding for a pass. */
export interface CourseEvidenceDto {
  passMark: number;
  /** The cohort has set no pass mark of its own: `passMark` is the training default. */
  passMarkIsDefault: boolean;
  theory: TheoryResultDto | null;
  /** Items in force first (in order), then retired items that carry a tick for this trainee. */
  checklist: ChecklistEntryDto[];
  attemptsMet: number;
  outstanding: string[];
}

const passMarkOf = (cohort: Cohort) => cohort.theoryPassMark ?? DEFAULT_THEORY_PASS_MARK;

/** The evidence, read inside the caller's transaction when given (the decision reads it under the cohort's lock). */
export async function courseEvidenceOf(cohort: Cohort, traineeId: number, transaction?: Transaction): Promise<CourseEvidenceDto> {
  const passMark = passMarkOf(cohort);
  // One after another: inside the decision's transaction they share one connection.
  const theoryRow = await TheoryResult.findOne({ where: { cohortId: cohort.id, userId: traineeId }, transaction });
  const items = await ChecklistItem.findAll({ where: { cohortId: cohort.id }, order: [['position', 'ASC'], ['id', 'ASC']], transaction });
  const ticks = await sequelize.query<{ id: number; item_id: number; observed: number; observed_by_name: string; observed_at: Date; note: string | null; version: number }>(
    'SELECT t.id, t.item_id, t.observed, t.observed_by_name, t.observed_at, t.note, t.version FROM checklist_ticks t JOIN checklist_items i ON i.id = t.item_id WHERE i.cohort_id = ? AND t.user_id = ?',
    { type: QueryTypes.SELECT, replacements: [cohort.id, traineeId], transaction },
  );
  const met = await sequelize.query<{ n: number }>(
    "SELECT COUNT(*) AS n FROM run_verdicts v JOIN runs r ON r.id = v.run_id WHERE r.cohort_id = ? AND r.operator_id = ? AND r.status = 'complete' AND v.all_met = 1",
    { type: QueryTypes.SELECT, replacements: [cohort.id, traineeId], transaction },
  );
  const tickOf = (itemId: number): ChecklistTickDto | null => {
    const row = ticks.find((t) => Number(t.item_id) === itemId);
    return row ? { id: Number(row.id), observed: Boolean(row.observed), byName: row.observed_by_name, at: new Date(row.observed_at).toISOString(), note: row.note, version: Number(row.version) } : null;
  };
  const entries = items.map((item) => ({ id: Number(item.id), label: item.label, retired: item.retiredAt !== null, tick: tickOf(Number(item.id)) }));
  const checklist = [...entries.filter((e) => !e.retired), ...entries.filter((e) => e.retired && e.tick)];
  const score = theoryRow ? Number(theoryRow.scorePercent) : null;
  const theory = theoryRow
    ? { id: Number(theoryRow.id), scorePercent: score!, takenOn: theoryRow.takenOn, enteredByName: theoryRow.enteredByName, enteredAt: theoryRow.enteredAt.toISOString(), passed: theoryPassed(score!, passMark), version: theoryRow.version }
    : null;
  const attemptsMet = Number(met[0]?.n ?? 0);
  const inForce = checklist.filter((e) => !e.retired).map((e) => ({ label: e.label, observed: e.tick?.observed ?? false }));
  return { passMark, passMarkIsDefault: cohort.theoryPassMark === null || cohort.theoryPassMark === undefined, theory, checklist, attemptsMet, outstanding: outstandingItems({ attemptsMet, theoryScore: score, theoryPassMark: passMark, checklist: inForce }) };
}

/** The cohort row, locked for a change of its course settings (one change at a time per cohort). */
async function lockedCohort(user: SessionUser | null, cohortId: number, transaction: Transaction): Promise<Cohort> {
  const cohort = await manageableCohort(user, cohortId);
  return (await Cohort.findByPk(cohort.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
}

/** The cohort's theory pass mark (percent); the change and its audit row commit together. */
export async function setTheoryPassMark(user: SessionUser | null, cohortId: number, input: unknown): Promise<number> {
  await manageableCohort(user, cohortId);
  const { passMark } = parseFields(passMarkSchema, input, 'The pass mark was not saved; check the field marked.');
  await sequelize.transaction(async (transaction) => {
    const cohort = await lockedCohort(user, cohortId, transaction);
    const before = { theoryPassMark: cohort.theoryPassMark ?? null, effective: passMarkOf(cohort) };
    await cohort.update({ theoryPassMark: passMark }, { transaction });
    await writeAudit(transaction, user, { objectType: 'criteria', objectId: cohort.id, action: 'theory_pass_mark', before, after: { theoryPassMark: passMark, effective: passMark } });
  });
  return passMark;
}

/**
 * Enters (or corrects) one trainee's theory result: score in percent, the day, who entered it.
 * `sentVersion` is the version the form was opened with (0 when there was no result yet): a save
 * from a form opened before someone else's save answers `conflict` and changes nothing.
 */
export async function recordTheoryResult(user: SessionUser | null, cohortId: number, traineeId: number, input: unknown, sentVersion: unknown, now = new Date()): Promise<TheoryResultDto> {
  await manageableCohort(user, cohortId);
  const data = parseFields(theoryResultSchema, input, 'The theory result was not saved; check the fields marked.');
  return sequelize.transaction(async (transaction) => {
    const cohort = await lockedCohort(user, cohortId, transaction);
    await cohortTrainee(cohort.id, traineeId, transaction);
    const row = await TheoryResult.findOne({ where: { cohortId: cohort.id, userId: traineeId }, transaction, lock: transaction.LOCK.UPDATE });
    const version = nextVersion(row?.version ?? 0, sentVersion);
    const before = row ? { scorePercent: Number(row.scorePercent), takenOn: row.takenOn, enteredByName: row.enteredByName } : null;
    const values = { scorePercent: data.score, takenOn: data.takenOn, enteredById: user!.id, enteredByName: user!.name, enteredAt: now, version };
    const saved = row ? await row.update(values, { transaction }) : await TheoryResult.create({ cohortId: cohort.id, userId: traineeId, ...values }, { transaction });
    const passMark = passMarkOf(cohort);
    await writeAudit(transaction, user, {
      objectType: 'theory_result',
      objectId: Number(saved.id),
      action: row ? 'update' : 'create',
      before,
      after: { scorePercent: data.score, takenOn: data.takenOn, enteredByName: user!.name, passMark, passed: theoryPassed(data.score, passMark) },
    });
    return { id: Number(saved.id), scorePercent: data.score, takenOn: data.takenOn, enteredByName: user!.name, enteredAt: now.toISOString(), passed: theoryPassed(data.score, passMark), version };
  });
}

/**
 * Saves the cohort's checklist: items kept by id (a changed label renames the item and keeps its
 * ticks), removed items retired (never deleted, so their ticks stay on record), new items added at
 * the end. An id that is not an item in force of this cohort is refused and changes nothing.
 */
export async function saveChecklist(user: SessionUser | null, cohortId: number, input: unknown, now = new Date()): Promise<{ active: number; retired: number; added: number }> {
  await manageableCohort(user, cohortId);
  const data = parseFields(checklistSchema, input, 'The checklist was not saved; check the items marked.');
  return sequelize.transaction(async (transaction) => {
    const cohort = await lockedCohort(user, cohortId, transaction);
    const current = await ChecklistItem.findAll({ where: { cohortId: cohort.id, retiredAt: null }, order: [['position', 'ASC'], ['id', 'ASC']], transaction });
    const byId = new Map(current.map((item) => [Number(item.id), item]));
    const unknown = data.items.filter((i) => !byId.has(i.id));
    if (unknown.length) throw new AppError('conflict', 'The checklist was changed by someone else since you opened it; reload.');
    const before = current.map((item) => ({ id: Number(item.id), label: item.label }));
    let position = 0;
    let retired = 0;
    for (const entry of data.items) {
      const item = byId.get(entry.id)!;
      if (entry.retire) {
        retired += 1;
        await item.update({ retiredAt: now }, { transaction });
      } else await item.update({ label: entry.label, position: ++position }, { transaction });
    }
    const kept = new Set(data.items.map((i) => i.id));
    for (const item of current) if (!kept.has(Number(item.id))) await item.update({ position: ++position }, { transaction });
    const known = new Set(data.items.filter((i) => !i.retire).map((i) => i.label.toLowerCase()));
    const added = data.added.filter((label) => !known.has(label.toLowerCase()));
    for (const label of added) await ChecklistItem.create({ cohortId: cohort.id, label, position: ++position, retiredAt: null, createdAt: now }, { transaction });
    const after = (await ChecklistItem.findAll({ where: { cohortId: cohort.id, retiredAt: null }, order: [['position', 'ASC'], ['id', 'ASC']], transaction })).map((item) => ({ id: Number(item.id), label: item.label }));
    await writeAudit(transaction, user, { objectType: 'criteria', objectId: cohort.id, action: 'checklist', before: { items: before }, after: { items: after, retired: data.items.filter((i) => i.retire).map((i) => i.id) } });
    return { active: after.length, retired, added: added.length };
  });
}

/**
 * Ticks (or un-ticks) one checklist item for one trainee: who, when, an optional note. The row is
 * kept either way. `sentVersion` is the tick's version when the form was opened (0 for no tick yet);
 * a stale one answers `conflict` and changes nothing.
 */
export async function setChecklistTick(user: SessionUser | null, cohortId: number, traineeId: number, input: unknown, sentVersion: unknown, now = new Date()): Promise<ChecklistTickDto> {
  await manageableCohort(user, cohortId);
  const data = parseFields(tickSchema, input, 'The observation was not saved; check the fields marked.');
  return sequelize.transaction(async (transaction) => {
    const cohort = await lockedCohort(user, cohortId, transaction);
    await cohortTrainee(cohort.id, traineeId, transaction);
    const item = await ChecklistItem.findOne({ where: { id: data.itemId, cohortId: cohort.id }, transaction });
    if (!item) throw new AppError('not_found', 'That checklist item does not exist in this cohort.');
    if (item.retiredAt !== null) throw new AppError('conflict', 'That item has been retired from the checklist; reload.');
    const row = await ChecklistTick.findOne({ where: { itemId: item.id, userId: traineeId }, transaction, lock: transaction.LOCK.UPDATE });
    const version = nextVersion(row?.version ?? 0, sentVersion);
    const before = row ? { observed: Boolean(row.observed), note: row.note, byName: row.observedByName } : null;
    const values = { observed: data.observed, note: data.note, observedById: user!.id, observedByName: user!.name, observedAt: now, version };
    const saved = row ? await row.update(values, { transaction }) : await ChecklistTick.create({ itemId: Number(item.id), userId: traineeId, ...values }, { transaction });
    await writeAudit(transaction, user, {
      objectType: 'checklist_tick',
      objectId: Number(saved.id),
      action: data.observed ? 'tick' : 'untick',
      before,
      after: { item: item.label, traineeId, observed: data.observed, note: data.note, byName: user!.name },
    });
    return { id: Number(saved.id), observed: data.observed, byName: user!.name, at: now.toISOString(), note: data.note, version };
  });
}
