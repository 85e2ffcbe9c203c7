'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { failureState, type ActionState } from '@/lib/http/form-state';
import { saveCohortCriteria, sendRunResults, signOffRun } from '@/lib/data/assessment';
import { createCohort } from '@/lib/data/cohorts';
import { inviteToCohort } from '@/lib/data/invitations';
import { getSessionUser } from '@/lib/auth/session';

const text = (form: FormData, name: string) => String(form.get(name) ?? '');

export async function createCohortAction(_previous: ActionState, form: FormData): Promise<ActionState> {
  let id: number;
  try {
    id = await createCohort(await getSessionUser(), { name: text(form, 'name'), site: text(form, 'site'), startsOn: text(form, 'startsOn'), endsOn: text(form, 'endsOn') });
  } catch (error) {
    return failureState(error);
  }
  revalidatePath('/cohorts');
  redirect(`/cohorts/${id}`);
}

export async function inviteAction(cohortId: number, _previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    const outcome = await inviteToCohort(await getSessionUser(), cohortId, text(form, 'addresses'));
    revalidatePath(`/cohorts/${cohortId}`);
    const parts = [
      outcome.invited.length ? `Invited ${outcome.invited.length}: ${outcome.invited.join(', ')}.` : null,
      outcome.attached.length ? `Added ${outcome.attached.length} existing account${outcome.attached.length === 1 ? '' : 's'}: ${outcome.attached.join(', ')}.` : null,
      outcome.alreadyMembers.length ? `Already in the cohort: ${outcome.alreadyMembers.join(', ')}.` : null,
      outcome.notSent.length ? `The e-mail to ${outcome.notSent.join(', ')} could not be sent; the invitation is saved — invite again to resend.` : null,
    ].filter(Boolean);
    return { ok: outcome.notSent.length === 0, message: parts.join(' ') };
  } catch (error) {
    return failureState(error);
  }
}

export async function saveCriteriaAction(cohortId: number, _previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    await saveCohortCriteria(await getSessionUser(), cohortId, {
      bandPercent: text(form, 'bandPercent'),
      maxCvPercent: text(form, 'maxCvPercent'),
      requirePattern: form.get('requirePattern') === 'on',
      maxYieldPercent: text(form, 'maxYieldPercent'),
    }, form.get('version'));
    revalidatePath(`/cohorts/${cohortId}`);
    return { ok: true, message: 'Criteria saved. Runs not yet signed off are judged against them now.' };
  } catch (error) {
    return failureState(error);
  }
}

export async function signOffAction(cohortId: number, runId: number, _previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    const { allMet } = await signOffRun(await getSessionUser(), runId, text(form, 'comment'));
    revalidatePath(`/cohorts/${cohortId}`);
    return { ok: true, message: `Signed off: ${allMet ? 'every criterion met' : 'not every criterion met'}.` };
  } catch (error) {
    return failureState(error);
  }
}

export async function sendResultsAction(cohortId: number, runId: number, _previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    const { to, cc } = await sendRunResults(await getSessionUser(), runId, form.get('copyEmployer') === 'on');
    revalidatePath(`/cohorts/${cohortId}`);
    const copyNote = form.get('copyEmployer') === 'on' && !cc ? ' No employer contact is on file, so no copy was sent.' : '';
    return { ok: true, message: `Results sent to ${to}${cc ? ` with a copy to ${cc}` : ''}.${copyNote}` };
  } catch (error) {
    return failureState(error);
  }
}
