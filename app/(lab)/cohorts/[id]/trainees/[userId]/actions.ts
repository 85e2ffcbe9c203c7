'use server';

import { revalidatePath } from 'next/cache';
import { okState } from '@/lib/http/form-state';
import { withActionRole } from '@/lib/http/server-action';
import { COHORT_ROLES } from '@/lib/data/cohort-access';
import { decideCourseOutcome, setRecordValidity } from '@/lib/data/qualification/course-outcomes';
import { recordTheoryResult, saveChecklist, setChecklistTick, setTheoryPassMark } from '@/lib/data/qualification/course-evidence';
import { listFromLines } from '@/lib/qualification/course-outcome';
import { issueTrainingRecord, reissueTrainingRecord, revokeTrainingRecord } from '@/lib/data/qualification/training-records';
import { formatVerificationCode } from '@/lib/qualification/verification-code';

const sheetPath = (cohortId: number, traineeId: number) => `/cohorts/${cohortId}/trainees/${traineeId}`;

export const decideOutcomeAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number) => {
  const outcome = await decideCourseOutcome(user, cohortId, traineeId, { decision: form.get('decision') ?? undefined, scopes: form.getAll('scopes').map(String), overrideReason: String(form.get('overrideReason') ?? '') }, form.get('version'));
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(outcome.decision === 'pass' ? (outcome.overrideReason ? 'Saved: pass, with the override reason on record.' : 'Saved: pass.') : 'Saved: not yet.');
});

export const recordValidityAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number) => {
  const { months, leadDays } = await setRecordValidity(user, cohortId, { months: form.get('months'), leadDays: form.get('leadDays') ?? undefined });
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(`Records of training from this cohort are now valid for ${months} months; the refresher reminder goes out ${leadDays} days before the end.`);
});

export const issueRecordAction = withActionRole(COHORT_ROLES, async (user, _form, cohortId: number, traineeId: number) => {
  const record = await issueTrainingRecord(user, cohortId, traineeId);
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(`Record of training issued: code ${formatVerificationCode(record.code)}.`);
});

export const revokeRecordAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number, recordId: number) => {
  await revokeTrainingRecord(user, recordId, String(form.get('reason') ?? ''));
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState('Record revoked.');
});

export const reissueRecordAction = withActionRole(COHORT_ROLES, async (user, _form, cohortId: number, traineeId: number, recordId: number) => {
  const record = await reissueTrainingRecord(user, recordId);
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(`Reissued with the new code ${formatVerificationCode(record.code)}; the old code now shows as revoked.`);
});

/** The cohort's theory pass mark in percent (a cohort setting, edited from any trainee's sheet). */
export const theoryPassMarkAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number) => {
  const mark = await setTheoryPassMark(user, cohortId, { passMark: form.get('passMark') ?? undefined });
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(`The theory pass mark of this cohort is now ${mark} %.`);
});

/** The trainee's theory result (score in percent and the day). */
export const theoryResultAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number) => {
  const result = await recordTheoryResult(user, cohortId, traineeId, { score: form.get('score') ?? undefined, takenOn: form.get('takenOn') ?? undefined }, form.get('version'));
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(`Theory result saved: ${result.scorePercent} %, ${result.passed ? 'passed' : 'not yet passed'}.`);
});

/** The cohort's observation checklist: items kept by id, renamed or retired, new ones added (one per line). */
export const checklistAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number) => {
  const items = form.getAll('itemId').map((id) => ({ id: Number(id), label: String(form.get(`label-${String(id)}`) ?? ''), retire: form.get(`retire-${String(id)}`) === 'on' }));
  const saved = await saveChecklist(user, cohortId, { items, added: listFromLines(String(form.get('added') ?? ''), 50) });
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(`Checklist saved: ${saved.active} item${saved.active === 1 ? '' : 's'}${saved.retired ? `, ${saved.retired} retired (their ticks are kept)` : ''}.`);
});

/** Ticks or un-ticks one checklist item for the trainee, with an optional note. */
export const checklistTickAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number) => {
  const tick = await setChecklistTick(user, cohortId, traineeId, { itemId: form.get('itemId') ?? undefined, observed: form.get('observed') === '1', note: String(form.get('note') ?? '') }, form.get('version'));
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(tick.observed ? 'Observed.' : 'Marked as not observed.');
});
