'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { okState, type FormState } from '@/lib/http/form-state';
import { withActionRole } from '@/lib/http/server-action';
import { saveCohortCriteria, sendRunResults, signOffRun } from '@/lib/data/assessment';
import { COHORT_ROLES } from '@/lib/data/cohort-access';
import { createCohort } from '@/lib/data/cohorts';
import { inviteToCohort, resendInvitation, type InviteOutcome } from '@/lib/data/invitations';

const text = (form: FormData, name: string) => String(form.get(name) ?? '');

export const createCohortAction = withActionRole(COHORT_ROLES, async (user, form) => {
  const id = await createCohort(user, { name: text(form, 'name'), site: text(form, 'site'), startsOn: text(form, 'startsOn'), endsOn: text(form, 'endsOn') });
  revalidatePath('/cohorts');
  redirect(`/cohorts/${id}`);
});

export const inviteAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number) => {
  const outcome = await inviteToCohort(user, cohortId, text(form, 'addresses'));
  revalidatePath(`/cohorts/${cohortId}`);
  return inviteState(outcome);
});

/** A fresh invitation link for someone who has not set a password (cohort page: that cohort; People page: their latest cohort). */
export const resendInviteAction = withActionRole(COHORT_ROLES, async (user, _form, userId: number, cohortId: number | null) => {
  const outcome = await resendInvitation(user, userId, cohortId);
  revalidatePath(cohortId === null ? '/people' : `/cohorts/${cohortId}`);
  return inviteState(outcome);
});

function inviteState(outcome: InviteOutcome): FormState<{ handOver: InviteOutcome['handOver'] }> {
  const parts = [
    outcome.invited.length ? `Invited ${outcome.invited.length}: ${outcome.invited.join(', ')}.` : null,
    outcome.attached.length ? `Added ${outcome.attached.length} existing account${outcome.attached.length === 1 ? '' : 's'}: ${outcome.attached.join(', ')}.` : null,
    outcome.alreadyMembers.length ? `Already in the cohort: ${outcome.alreadyMembers.join(', ')}.` : null,
    outcome.notSent.length ? `The e-mail to ${outcome.notSent.join(', ')} could not be sent; the invitation is saved. Copy the link below and hand it over another way, or resend later.` : null,
  ].filter(Boolean);
  return { status: outcome.notSent.length === 0 ? 'ok' : 'error', message: parts.join(' '), data: { handOver: outcome.handOver } };
}

export const saveCriteriaAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number) => {
  await saveCohortCriteria(user, cohortId, {
    bandPercent: text(form, 'bandPercent'),
    maxCvPercent: text(form, 'maxCvPercent'),
    requirePattern: form.get('requirePattern') === 'on',
    maxYieldPercent: text(form, 'maxYieldPercent'),
  }, form.get('version'));
  revalidatePath(`/cohorts/${cohortId}`);
  return okState('Criteria saved. Runs not yet signed off are judged against them now.');
});

export const signOffAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, runId: number) => {
  const { allMet } = await signOffRun(user, runId, text(form, 'comment'));
  revalidatePath(`/cohorts/${cohortId}`);
  return okState(`Signed off: ${allMet ? 'every criterion met' : 'not every criterion met'}.`);
});

export const sendResultsAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number, runId: number) => {
  const { to, cc } = await sendRunResults(user, runId, form.get('copyEmployer') === 'on');
  revalidatePath(`/cohorts/${cohortId}`);
  const copyNote = form.get('copyEmployer') === 'on' && !cc ? ' No employer contact is on file, so no copy was sent.' : '';
  return okState(`Results sent to ${to}${cc ? ` with a copy to ${cc}` : ''}.${copyNote}`);
});
