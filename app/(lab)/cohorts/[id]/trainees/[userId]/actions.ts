'use server';

import { revalidatePath } from 'next/cache';
import { okState } from '@/lib/http/form-state';
import { withActionRole } from '@/lib/http/server-action';
import { COHORT_ROLES } from '@/lib/data/cohort-access';
import { decideCourseOutcome, setRecordValidity } from '@/lib/data/qualification/course-outcomes';
import { issueTrainingRecord, reissueTrainingRecord, revokeTrainingRecord } from '@/lib/data/qualification/training-records';
import { formatVerificationCode } from '@/lib/qualification/verification-code';

const sheetPath = (cohortId: number, traineeId: number) => `/cohorts/${cohortId}/trainees/${traineeId}`;

export const decideOutcomeAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, traineeId: number) => {
  const outcome = await decideCourseOutcome(user, cohortId, traineeId, { decision: form.get('decision') ?? undefined, scopes: form.getAll('scopes').map(String) }, form.get('version'));
  revalidatePath(sheetPath(cohortId, traineeId));
  return okState(outcome.decision === 'pass' ? 'Saved: pass.' : 'Saved: not yet.');
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
