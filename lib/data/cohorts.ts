import 'server-only';
import { z } from 'zod';
import { Cohort, CohortMember, Joint, Method, OneTimeToken, Run, RunVerdict, User } from '@/models';
import type { CriterionResult } from '../assessment/judge-run';
import { attemptKind, runSourceLine, type AttemptKind } from '../qualification/attempt-kind';
import { AppError } from '../http/errors';
import { isoDateSchema } from '../validation/iso-date';
import { nameSchema } from '../validation/display-name';
import { assertRole, type SessionUser } from '../auth/session';
import { criteriaForCohort, judgeRuns, type CohortCriteriaDto } from './assessment';
import { COHORT_ROLES, manageableCohort } from './cohort-access';

const isoDate = isoDateSchema('Enter a real date like 2026-03-31.');

export const newCohortSchema = z
  .object({
    name: nameSchema({ what: 'the course name', min: 3, tooShort: 'Give the course a name of at least 3 characters.' }),
    site: z.string().trim().min(2, { error: 'Name the site where the course runs.' }).max(160, { error: 'Keep the site under 160 characters.' }),
    startsOn: isoDate,
    endsOn: isoDate,
  })
  .refine((c) => c.startsOn <= c.endsOn, { message: 'The last day cannot be before the first day.', path: ['endsOn'] });

export interface CohortListItem {
  id: number;
  name: string;
  site: string;
  startsOn: string;
  endsOn: string;
  instructorName: string;
  members: number;
  runs: number;
  signedOff: number;
}

export async function listCohorts(user: SessionUser | null): Promise<CohortListItem[]> {
  assertRole(user, COHORT_ROLES);
  const cohorts = await Cohort.findAll({
    where: user.role === 'admin' ? {} : { instructorId: user.id },
    include: [{ model: User, as: 'instructor', attributes: ['name'] }],
    order: [['startsOn', 'DESC'], ['id', 'DESC']],
  });
  const ids = cohorts.map((c) => c.id);
  const [members, runs, verdicts] = ids.length
    ? await Promise.all([
        CohortMember.count({ where: { cohortId: ids }, group: ['cohortId'] }),
        Run.count({ where: { cohortId: ids }, group: ['cohortId'] }),
        RunVerdict.count({ where: { cohortId: ids }, group: ['cohortId'] }),
      ])
    : [[], [], []];
  const countFor = (rows: unknown, id: number) => Number((rows as { cohortId: number; count: number }[]).find((r) => r.cohortId === id)?.count ?? 0);
  return cohorts.map((c) => ({
    id: c.id,
    name: c.name,
    site: c.site,
    startsOn: c.startsOn,
    endsOn: c.endsOn,
    instructorName: (c as Cohort & { instructor?: User }).instructor?.name ?? '',
    members: countFor(members, c.id),
    runs: countFor(runs, c.id),
    signedOff: countFor(verdicts, c.id),
  }));
}

/** Creates a cohort taught by the signed-in instructor (an admin creating one teaches it too). */
export async function createCohort(user: SessionUser | null, input: unknown): Promise<number> {
  assertRole(user, COHORT_ROLES);
  const parsed = newCohortSchema.safeParse(input);
  if (!parsed.success) throw new AppError('invalid_input', 'The cohort was not created; correct the fields marked.', { fieldErrors: parsed.error.flatten().fieldErrors });
  const cohort = await Cohort.create({ ...parsed.data, instructorId: user.id });
  return cohort.id;
}

export interface CohortRunRow {
  id: number;
  recordedAt: string;
  operatorId: number;
  operatorName: string;
  methodName: string;
  jointName: string;
  status: string;
  /** Assessed attempt, practice or simulated (lib/qualification/attempt-kind.ts). */
  attemptKind: AttemptKind;
  /** How the run came in and who recorded or confirmed it, for sheets. */
  sourceLine: string;
  finalCv: number | null;
  /** The judgement now, against the cohort's current criteria (null when the run cannot be judged). */
  judgement: { results: CriterionResult[]; allMet: boolean } | null;
  verdict: { id: number; allMet: boolean; results: CriterionResult[]; comment: string | null; signedByName: string; signedAt: string; resultsSentAt: string | null } | null;
}

export interface CohortMemberRow {
  id: number;
  name: string;
  email: string;
  employerContact: string | null;
  /** Invited, password not set yet. */
  pending: boolean;
  inviteExpired: boolean;
  isActive: boolean;
  /** Complete assessed attempts (witnessed by the cohort's instructor). */
  attempts: number;
  /** Complete practice runs (recorded by the trainee and not confirmed). */
  practiceRuns: number;
  latestRunId: number | null;
  latestCv: number | null;
  latestMet: number | null;
  latestOf: number | null;
}

export interface CohortDetail {
  id: number;
  name: string;
  site: string;
  startsOn: string;
  endsOn: string;
  instructorName: string;
  criteria: CohortCriteriaDto;
  members: CohortMemberRow[];
  runs: CohortRunRow[];
}

export async function cohortDetail(user: SessionUser | null, cohortId: number, now = new Date()): Promise<CohortDetail> {
  const cohort = await manageableCohort(user, cohortId);
  const [instructor, memberRows, runs, criteria] = await Promise.all([
    User.findByPk(cohort.instructorId, { attributes: ['name'] }),
    CohortMember.findAll({ where: { cohortId: cohort.id } }),
    Run.findAll({
      where: { cohortId: cohort.id },
      include: [
        { model: Method, as: 'method', attributes: ['name'] },
        { model: Joint, as: 'joint', attributes: ['name'] },
        { model: User, as: 'operator', attributes: ['id', 'name'] },
      ],
      order: [['recordedAt', 'ASC'], ['id', 'ASC']],
    }),
    criteriaForCohort(cohort.id),
  ]);
  const memberIds = memberRows.map((m) => m.userId);
  const [users, invites, verdicts] = await Promise.all([
    memberIds.length ? User.findAll({ where: { id: memberIds }, order: [['name', 'ASC']] }) : [],
    memberIds.length ? OneTimeToken.findAll({ where: { userId: memberIds, purpose: 'invite', usedAt: null } }) : [],
    RunVerdict.findAll({ where: { cohortId: cohort.id }, include: [{ model: User, as: 'signedBy', attributes: ['name'] }] }),
  ]);
  const peopleIds = [...new Set(runs.flatMap((r) => [r.recordedById, r.assessedConfirmedById]).filter((id): id is number => id !== null))];
  const people = new Map((peopleIds.length ? await User.findAll({ where: { id: peopleIds }, attributes: ['id', 'name'] }) : []).map((u) => [u.id, u.name]));
  const nameOf = (id: number | null) => (id === null ? null : (people.get(id) ?? null));
  const judged = await judgeRuns(runs.filter((r) => r.status === 'complete').map((r) => r.id), criteria);
  const runRows: CohortRunRow[] = runs.map((run) => {
    const r = run as Run & { method: Method; joint: Joint; operator: User };
    const verdict = verdicts.find((v) => v.runId === run.id);
    return {
      id: r.id,
      recordedAt: r.recordedAt.toISOString(),
      operatorId: r.operatorId,
      operatorName: r.operator.name,
      methodName: r.method.name,
      jointName: r.joint.name,
      status: r.status,
      attemptKind: attemptKind({ source: r.source, cohortInstructorId: cohort.instructorId, recordedById: r.recordedById, assessedConfirmedById: r.assessedConfirmedById }),
      sourceLine: runSourceLine(r.source, nameOf(r.recordedById), nameOf(r.assessedConfirmedById)),
      finalCv: r.finalCv,
      judgement: judged.get(r.id) ?? null,
      verdict: verdict
        ? {
            id: verdict.id,
            allMet: Boolean(verdict.allMet),
            results: verdict.results,
            comment: verdict.comment,
            signedByName: (verdict as RunVerdict & { signedBy?: User }).signedBy?.name ?? '',
            signedAt: verdict.signedAt.toISOString(),
            resultsSentAt: verdict.resultsSentAt?.toISOString() ?? null,
          }
        : null,
    };
  });
  const members: CohortMemberRow[] = users.map((u) => {
    const complete = runRows.filter((r) => r.operatorId === u.id && r.status === 'complete');
    const own = complete.filter((r) => r.attemptKind === 'assessed');
    const latest = own[own.length - 1];
    const latestResults = latest?.verdict?.results ?? latest?.judgement?.results ?? null;
    const invite = invites.filter((i) => i.userId === u.id).sort((a, b) => b.expiresAt.getTime() - a.expiresAt.getTime())[0];
    return {
      id: u.id,
      name: u.name,
      email: u.email,
      employerContact: u.employerContact,
      pending: u.passwordHash === null,
      inviteExpired: u.passwordHash === null && (!invite || invite.expiresAt.getTime() <= now.getTime()),
      isActive: Boolean(u.isActive),
      attempts: own.length,
      practiceRuns: complete.filter((r) => r.attemptKind === 'practice').length,
      latestRunId: latest?.id ?? null,
      latestCv: latest?.finalCv ?? null,
      latestMet: latestResults ? latestResults.filter((x) => x.met).length : null,
      latestOf: latestResults ? latestResults.length : null,
    };
  });
  return {
    id: cohort.id,
    name: cohort.name,
    site: cohort.site,
    startsOn: cohort.startsOn,
    endsOn: cohort.endsOn,
    instructorName: instructor?.name ?? '',
    criteria,
    members,
    runs: runRows,
  };
}
