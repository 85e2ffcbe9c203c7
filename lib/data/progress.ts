import 'server-only';
import { Cohort, Joint, Method, Run, RunComment, RunVerdict, User } from '@/models';
import type { CriterionResult } from '../assessment/judge-run';
import { attemptKind, type AttemptKind } from '../qualification/attempt-kind';
import { largestDeviationFromTarget } from '../stats/largest-deviation-from-target';
import { assertRole, type SessionUser } from '../auth/session';
import { criteriaForCohort, judgeInputs, judgeRuns } from './assessment';

export interface ProgressRun {
  id: number;
  attempt: number;
  /** Assessed attempt (witnessed by the course's instructor), practice or simulated. */
  kind: AttemptKind;
  recordedAt: string;
  cohortName: string | null;
  methodName: string;
  jointName: string;
  cvPercent: number | null;
  largestDeviationPercent: number | null;
  verdict: { allMet: boolean; comment: string | null; signedByName: string; signedAt: string } | null;
}

export interface TraineeProgress {
  runs: ProgressRun[];
  /** The latest complete run judged against its cohort's criteria now. */
  latest: { runId: number; cohortName: string; results: CriterionResult[]; allMet: boolean } | null;
  comments: { runId: number; attempt: number; author: string; body: string; at: string }[];
}

/** A trainee's own complete runs in order, with evenness figures, verdicts and comments. */
export async function traineeProgress(user: SessionUser | null): Promise<TraineeProgress> {
  assertRole(user, ['trainee']);
  const runs = await Run.findAll({
    where: { operatorId: user.id, status: 'complete' },
    include: [
      { model: Method, as: 'method', attributes: ['name'] },
      { model: Joint, as: 'joint', attributes: ['name'] },
      { model: Cohort, as: 'cohort', attributes: ['id', 'name', 'instructorId'] },
    ],
    order: [['recordedAt', 'ASC'], ['id', 'ASC']],
  });
  const ids = runs.map((r) => r.id);
  const [verdicts, runComments] = ids.length
    ? await Promise.all([
        RunVerdict.findAll({ where: { runId: ids }, include: [{ model: User, as: 'signedBy', attributes: ['name'] }] }),
        RunComment.findAll({ where: { runId: ids }, include: [{ model: User, as: 'author', attributes: ['name'] }], order: [['createdAt', 'ASC']] }),
      ])
    : [[], []];
  // Largest deviation from target needs the final loads: judgeInputs loads them in a few queries.
  const inputs = await judgeInputs(ids, { bandPercent: 10, maxCvPercent: 5, requirePattern: false, maxYieldPercent: 70 });
  const rows: ProgressRun[] = runs.map((run, index) => {
    const r = run as Run & { method: Method; joint: Joint; cohort: Cohort | null };
    const verdict = verdicts.find((v) => v.runId === r.id);
    const input = inputs.get(r.id);
    return {
      id: r.id,
      attempt: index + 1,
      kind: attemptKind({ source: r.source, cohortInstructorId: r.cohort?.instructorId ?? null, recordedById: r.recordedById, assessedConfirmedById: r.assessedConfirmedById }),
      recordedAt: r.recordedAt.toISOString(),
      cohortName: r.cohort?.name ?? null,
      methodName: r.method.name,
      jointName: r.joint.name,
      cvPercent: r.finalCv === null ? null : r.finalCv * 100,
      largestDeviationPercent: input ? Math.abs(largestDeviationFromTarget(input.finalLoadsN, input.targetLoadN).percent) : null,
      verdict: verdict
        ? { allMet: Boolean(verdict.allMet), comment: verdict.comment, signedByName: (verdict as RunVerdict & { signedBy?: User }).signedBy?.name ?? '', signedAt: verdict.signedAt.toISOString() }
        : null,
    };
  });
  const latestInCohort = [...runs].reverse().find((r) => r.cohortId !== null) as (Run & { cohort: Cohort | null }) | undefined;
  let latest: TraineeProgress['latest'] = null;
  if (latestInCohort?.cohortId) {
    const { isDefault: _d, version: _v, ...criteria } = await criteriaForCohort(latestInCohort.cohortId);
    const judgement = (await judgeRuns([latestInCohort.id], criteria)).get(latestInCohort.id);
    if (judgement) latest = { runId: latestInCohort.id, cohortName: latestInCohort.cohort?.name ?? '', ...judgement };
  }
  const attemptOf = (runId: number) => rows.find((r) => r.id === runId)?.attempt ?? 0;
  const comments = [
    ...verdicts.filter((v) => v.comment).map((v) => ({ runId: v.runId, attempt: attemptOf(v.runId), author: (v as RunVerdict & { signedBy?: User }).signedBy?.name ?? '', body: v.comment ?? '', at: v.signedAt.toISOString() })),
    ...runComments.map((c) => ({ runId: c.runId, attempt: attemptOf(c.runId), author: (c as RunComment & { author?: User }).author?.name ?? '', body: c.body, at: c.createdAt.toISOString() })),
  ].sort((a, b) => b.at.localeCompare(a.at));
  return { runs: rows, latest, comments };
}
