'use client';

import { useActionState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '@/components/ui/form-message';

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

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
      {actions.setAside ? <ReasonForm action={actions.setAside} id="set-aside" label="Reason for setting this run aside" button="Set aside"
        hint="A set-aside run stays on record but leaves comparisons, progress and assessments." /> : null}
      {actions.restore ? <ReasonForm action={actions.restore} id="restore" label="Reason for restoring this run" button="Restore" hint="The run counts again in comparisons and progress." /> : null}
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

function ReasonForm({ action, id, label, button, hint }: { action: Action; id: string; label: string; button: string; hint: string }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  return (
    <form action={formAction} className="space-y-2">
      <label htmlFor={`${id}-reason`} className="block text-sm font-medium">{label}</label>
      <p id={`${id}-hint`} className="text-xs text-muted">{hint}</p>
      <input id={`${id}-reason`} name="reason" required minLength={3} maxLength={400} aria-describedby={`${id}-hint`} className="w-full rounded-md border border-rule bg-paper p-2" />
      {state.fieldErrors?.reason?.map((e) => <p key={e} className="text-sm text-danger">{e}</p>)}
      <FormMessage status={state.status} message={state.message} />
      <button type="submit" disabled={pending} className="rounded-md border border-rule px-4 py-2 hover:bg-rule/60 disabled:opacity-60">{pending ? 'Saving…' : button}</button>
    </form>
  );
}
