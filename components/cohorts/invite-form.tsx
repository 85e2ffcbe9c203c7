'use client';

import { useActionState } from 'react';
import { inviteAction } from '@/app/(lab)/cohorts/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';
import { InviteLinks } from './invite-links';

export function InviteForm({ cohortId }: { cohortId: number }) {
  const [state, action, pending] = useActionState(inviteAction.bind(null, cohortId), IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="space-y-2" noValidate>
      <label htmlFor="addresses" className="block text-sm font-medium">E-mail addresses</label>
      <textarea id="addresses" name="addresses" rows={4} aria-describedby="addresses-hint addresses-error"
        className="w-full rounded-md border border-rule bg-paper px-3 py-2 font-mono text-sm text-ink" />
      <p id="addresses-hint" className="text-xs text-muted">
        One address, or a pasted list separated by commas, semicolons or new lines. If any entry is not an address, nobody is
        invited and every rejected entry is named, so you correct the list once. Existing accounts are added to the cohort.
      </p>
      <FieldError id="addresses-error" messages={state.fieldErrors?.addresses} />
      <div className="flex flex-wrap items-center gap-4">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">
          {pending ? 'Inviting…' : 'Send invitations'}
        </button>
        <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
      </div>
      <InviteLinks links={state.data?.handOver} />
    </form>
  );
}
