import 'server-only';
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { criteriaSchema, DEFAULT_CRITERIA, type AssessmentCriteria } from '../assessment/criteria';
import { judgeRun, type Judgement, type JudgeRunInput } from '../assessment/judge-run';
import { threadSpecOf } from '../joints/joint-properties';
import { appBaseUrl } from '../platform/env';
import { AppError } from '../http/errors';
import { sendMail } from '../mail/mailer';
import { resultsMail } from '../mail/templates';
import type { SessionUser } from '../auth/session';
import { Cohort, CohortCriteria, Joint, Method, Run, RunVerdict, User, sequelize } from '@/models';
import type { MethodPass } from '@/models/method';
import { manageableCohort } from './cohort-access';
import { nextVersion } from './optimistic-lock';
import { writeAudit } from './audit-log';
import { assertAssessedAttempt, attemptRow } from './qualification/attempts';

export interface CohortCriteriaDto extends AssessmentCriteria {
  /** True while the cohort still uses the defaults (nothing saved yet). */
  isDefault: boolean;
  /** Sent back by the criteria form (optimistic locking); 0 while nothing is saved. */
  version: number;
}

export async function criteriaForCohort(cohortId: number, transaction?: Transaction): Promise<CohortCriteriaDto> {
  const row = await CohortCriteria.findByPk(cohortId, { transaction });
  if (!row) return { ...DEFAULT_CRITERIA, isDefault: true, version: 0 };
  return { bandPercent: row.bandPercent, maxCvPercent: row.maxCvPercent, requirePattern: Boolean(row.requirePattern), maxYieldPercent: row.maxYieldPercent, isDefault: false, version: row.version };
}

/**
 * Saves a cohort's criteria when `sentVersion` is the version the form was opened with.
 * @throws AppError `invalid_input` with per-field messages, `conflict` for a stale form; nothing is saved then.
 */
export async function saveCohortCriteria(user: SessionUser | null, cohortId: number, input: unknown, sentVersion: unknown): Promise<AssessmentCriteria> {
  const cohort = await manageableCohort(user, cohortId);
  const parsed = criteriaSchema.safeParse(input);
  if (!parsed.success) {
    throw new AppError('invalid_input', 'Some criteria are outside sensible limits; nothing was saved. Correct the fields marked.', { fieldErrors: parsed.error.flatten().fieldErrors });
  }
  await sequelize.transaction(async (transaction) => {
    // The cohort's row is the lock for a first save too (no criteria row yet to hold).
    await Cohort.findByPk(cohort.id, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
    const row = await CohortCriteria.findByPk(cohort.id, { transaction, lock: transaction.LOCK.UPDATE });
    const version = nextVersion(row?.version ?? 0, sentVersion);
    await CohortCriteria.upsert({ cohortId: cohort.id, ...parsed.data, updatedById: user!.id, version }, { transaction });
    const before = row ? { bandPercent: row.bandPercent, maxCvPercent: row.maxCvPercent, requirePattern: Boolean(row.requirePattern), maxYieldPercent: row.maxYieldPercent } : null;
    await writeAudit(transaction, user, { objectType: 'criteria', objectId: cohort.id, action: row ? 'update' : 'create', before, after: parsed.data });
  });
  return parsed.data;
}

/** Loads what judgeRun needs for several runs in a few queries (runs, joints, methods, steps, readings). */
export async function judgeInputs(runIds: number[], criteria: AssessmentCriteria, transaction?: Transaction): Promise<Map<number, JudgeRunInput>> {
  const out = new Map<number, JudgeRunInput>();
  if (!runIds.length) return out;
  const runs = await Run.findAll({ where: { id: runIds }, transaction });
  const joints = await Joint.findAll({ where: { id: [...new Set(runs.map((r) => r.jointId))] }, transaction });
  const methods = await Method.findAll({ where: { id: [...new Set(runs.map((r) => r.methodId))] }, transaction });
  const steps = await sequelize.query<{ id: number; run_id: number; step_order: number; pass_number: number; position: number }>(
    'SELECT id, run_id, step_order, pass_number, position FROM tightening_steps WHERE run_id IN (?) ORDER BY run_id, step_order',
    { type: QueryTypes.SELECT, replacements: [runIds], transaction },
  );
  const readings = await sequelize.query<{ step_id: number; position: number; load_n: number }>(
    'SELECT step_id, position, load_n FROM readings WHERE run_id IN (?)',
    { type: QueryTypes.SELECT, replacements: [runIds], transaction },
  );
  const loadsByStep = new Map<number, number[]>();
  for (const r of readings) {
    const list = loadsByStep.get(Number(r.step_id)) ?? [];
    list[Number(r.position) - 1] = Number(r.load_n);
    loadsByStep.set(Number(r.step_id), list);
  }
  for (const run of runs) {
    const joint = joints.find((j) => j.id === run.jointId);
    const method = methods.find((m) => m.id === run.methodId);
    const runSteps = steps.filter((s) => Number(s.run_id) === run.id);
    const last = runSteps[runSteps.length - 1];
    if (!joint || !method || !last) continue;
    const finalLoadsN = loadsByStep.get(Number(last.id)) ?? [];
    if (finalLoadsN.length !== run.studCount) continue;
    out.set(run.id, {
      targetLoadN: run.targetLoadN,
      finalLoadsN,
      steps: runSteps.map((s) => ({ order: Number(s.step_order), pass: Number(s.pass_number), position: Number(s.position), loadsN: loadsByStep.get(Number(s.id)) ?? [] })),
      method: { passes: method.passes as MethodPass[], checkPasses: method.checkPasses },
      joint: {
        studCount: joint.studCount,
        thread: threadSpecOf(joint),
        studGrade: joint.studGrade,
      },
      criteria,
    });
  }
  return out;
}

/** Judges runs against criteria; runs without usable final loads are left out. */
export async function judgeRuns(runIds: number[], criteria: AssessmentCriteria, transaction?: Transaction): Promise<Map<number, Judgement>> {
  const inputs = await judgeInputs(runIds, criteria, transaction);
  return new Map([...inputs].map(([id, input]) => [id, judgeRun(input)]));
}

async function cohortRun(user: SessionUser | null, runId: number, transaction?: Transaction) {
  const run = Number.isInteger(runId) && runId > 0 ? await Run.findByPk(runId, { transaction }) : null;
  if (!run || run.cohortId === null) throw new AppError('not_found', 'That run does not exist, or it does not belong to a cohort you teach.');
  const cohort = await manageableCohort(user, run.cohortId);
  return { run, cohort };
}

/**
 * Signs a run's result off: judges it now against the cohort's criteria and stores both as a
 * snapshot with the comment. A run is signed off once.
 */
export async function signOffRun(user: SessionUser | null, runId: number, rawComment: unknown): Promise<{ verdictId: number; allMet: boolean }> {
  const { run, cohort } = await cohortRun(user, runId);
  const comment = typeof rawComment === 'string' ? rawComment.trim() : '';
  if (comment.length > 4000) throw new AppError('invalid_input', 'The comment is longer than 4,000 characters; shorten it.', { fieldErrors: { comment: ['The comment is longer than 4,000 characters; shorten it.'] } });
  if (run.status === 'needs_review') throw new AppError('invalid_input', 'Only complete runs can be signed off; this run needs review first: confirm it or set it aside on its report.');
  if (run.status !== 'complete') throw new AppError('invalid_input', `Only complete runs can be signed off; this run is ${run.status.replace('_', ' ')}.`);
  const facts = await attemptRow(run.id);
  if (facts) assertAssessedAttempt(facts);
  try {
    return await sequelize.transaction(async (transaction) => {
      // Lock the run's own row (it exists), not the verdict's gap: simultaneous sign-offs queue
      // here one behind the other instead of deadlocking on the verdict index.
      await Run.findByPk(run.id, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
      const existing = await RunVerdict.findOne({ where: { runId: run.id }, transaction });
      if (existing) throw alreadySignedOff(existing.signedAt);
      // Read again under the lock: a confirmation or a set-aside may have landed since the check above.
      const facts = await attemptRow(run.id, transaction);
      if (!facts || facts.status !== 'complete') throw new AppError('invalid_input', 'Only complete runs can be signed off; this run has changed since you opened it.');
      assertAssessedAttempt(facts);
      const { isDefault: _isDefault, version: _version, ...criteria } = await criteriaForCohort(cohort.id, transaction);
      const judgement = (await judgeRuns([run.id], criteria, transaction)).get(run.id);
      if (!judgement) throw new AppError('invalid_input', 'This run has no final loads for every stud, so it cannot be judged.');
      const now = new Date();
      const verdict = await RunVerdict.create(
        { runId: run.id, cohortId: cohort.id, criteria, results: judgement.results, allMet: judgement.allMet, comment: comment || null, signedById: user!.id, signedAt: now },
        { transaction },
      );
      await writeAudit(transaction, user, { objectType: 'verdict', objectId: verdict.id, action: 'sign_off', after: { runId: run.id, criteria, allMet: judgement.allMet, comment: comment || null } });
      await writeAudit(transaction, user, { objectType: 'run', objectId: run.id, action: 'sign_off', after: { verdictId: verdict.id, allMet: judgement.allMet } });
      return { verdictId: verdict.id, allMet: judgement.allMet };
    });
  } catch (error) {
    // A second instance that inserted between our check and our insert: the unique index answers.
    if (error instanceof UniqueConstraintError) throw alreadySignedOff((await RunVerdict.findOne({ where: { runId: run.id } }))?.signedAt ?? new Date());
    throw error;
  }
}

const alreadySignedOff = (signedAt: Date) => new AppError('conflict', `This run is already signed off (on ${signedAt.toISOString().slice(0, 10)}); nothing was changed.`);

/** Sends the signed result to the trainee (and, when asked and known, their employer contact). */
export async function sendRunResults(user: SessionUser | null, runId: number, copyEmployer: boolean): Promise<{ to: string; cc: string | null }> {
  const { run, cohort } = await cohortRun(user, runId);
  const verdict = await RunVerdict.findOne({ where: { runId: run.id } });
  if (!verdict) throw new AppError('invalid_input', 'Sign the result off first; then the results e-mail can be sent.');
  const [trainee, signer, joint, method] = await Promise.all([
    User.findByPk(run.operatorId),
    User.findByPk(verdict.signedById),
    Joint.findByPk(run.jointId),
    Method.findByPk(run.methodId),
  ]);
  if (!trainee) throw new AppError('not_found', 'The trainee of this run no longer has an account.');
  const cc = copyEmployer && trainee.employerContact ? trainee.employerContact : null;
  const content = resultsMail({
    traineeName: trainee.name,
    cohortName: cohort.name,
    recordedAt: run.recordedAt,
    jointName: joint?.name ?? 'joint',
    methodName: method?.name ?? 'method',
    results: verdict.results,
    allMet: Boolean(verdict.allMet),
    comment: verdict.comment,
    signedByName: signer?.name ?? 'your instructor',
    reportLink: `${appBaseUrl()}/runs/${run.id}`,
  });
  await sendMail({ to: trainee.email, ...(cc ? { cc } : {}), ...content });
  await verdict.update({ resultsSentAt: new Date() });
  return { to: trainee.email, cc };
}
