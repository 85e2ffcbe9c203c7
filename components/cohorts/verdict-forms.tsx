'use client';

import { useActionState } from 'react';
import { sendResultsAction, signOffAction } from '@/app/(lab)/cohorts/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

export function SignOffForm({ cohortId, runId }: { cohortId: number; runId: number }) {
  const [state, action, pending] = useActionState(signOffAction.bind(null, cohortId, runId), IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="space-y-1" noValidate>
      <label htmlFor={`comment-${runId}`} className="block text-sm font-medium">Comment for the trainee</label>
      <textarea id={`comment-${runId}`} name="comment" rows={2} aria-describedby={`comment-${runId}-error`}
        className="w-full rounded-md border border-rule bg-paper px-3 py-2 text-sm text-ink" />
      <FieldError id={`comment-${runId}-error`} messages={state.fieldErrors?.comment} />
      <div className="flex flex-wrap items-center gap-4">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-60">
          {pending ? 'Signing off…' : 'Sign off this result'}
        </button>
        <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
      </div>
    </form>
  );
}

export function SendResultsForm({ cohortId, runId, employerContact, sentAt }: { cohortId: number; runId: number; employerContact: string | null; sentAt: string | null }) {
  const [state, action, pending] = useActionState(sendResultsAction.bind(null, cohortId, runId), IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="flex flex-wrap items-center gap-4" noValidate>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="copyEmployer" disabled={!employerContact} />
        {employerContact ? `Copy to employer contact (${employerContact})` : 'No employer contact on file'}
      </label>
      <button type="submit" disabled={pending} className="rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60 disabled:opacity-60">
        {pending ? 'Sending…' : sentAt ? 'Send the results e-mail again' : 'Send results e-mail'}
      </button>
      <FormMessage status={state.status} message={state.message} />
    </form>
  );
}
