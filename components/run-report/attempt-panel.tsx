'use client';

import { useActionState } from 'react';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { FormMessage } from '@/components/ui/form-message';
import { ReasonForm, SetAsideForm, type RunStatusAction as Action } from './set-aside-form';

export interface AttemptActions {
  confirm: Action | null;
  setAside: Action | null;
  restore: Action | null;
}

/** The instructor's controls for a run as an attempt: confirm a trainee's run as witnessed, set it aside or restore it. */
export function AttemptPanel({ actions }: { actions: AttemptActions }) {
  if (!actions.confirm && !actions.setAside && !actions.restore) return null;
  return (
    <section aria-labelledby="attempt-heading" className="no-print space-y-4 rounded-card border border-rule bg-panel p-4">
      <h2 id="attempt-heading" className="text-lg font-semibold">Attempt and status</h2>
      {actions.confirm ? <ConfirmForm action={actions.confirm} /> : null}
      {actions.setAside ? <SetAsideForm action={actions.setAside} /> : null}
      {actions.restore ? <ReasonForm action={actions.restore} id="restore" label="Reason for restoring this run" button="Restore" hint="The run goes back to where it was: a complete run counts again in comparisons and progress; a run held for review is held again until it is confirmed." /> : null}
    </section>
  );
}

function ConfirmForm({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  return (
    <form action={formAction} className="space-y-2">
      <p className="text-sm">The trainee recorded this run, so it counts as practice. Confirm only if you watched the whole tightening.</p>
      <FormMessage status={state.status} message={state.message} />
      <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-accent-ink disabled:opacity-60">
        {pending ? 'Confirming…' : 'I witnessed this run: count it as an assessed attempt'}
      </button>
    </form>
  );
}
