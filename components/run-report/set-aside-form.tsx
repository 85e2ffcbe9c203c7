'use client';

import { useActionState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '@/components/ui/form-message';

export type RunStatusAction = (state: FormState, formData: FormData) => Promise<FormState>;

/** A status change of a run with its reason (3–400 characters). */
export function ReasonForm({ action, id, label, button, hint }: { action: RunStatusAction; id: string; label: string; button: string; hint: string }) {
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

/** The one set-aside form, on the attempt panel (a complete run) and the needs-review panel (a held run); both post `setAsideAction`. */
export function SetAsideForm({ action }: { action: RunStatusAction }) {
  return (
    <ReasonForm action={action} id="set-aside" label="Reason for setting this run aside" button="Set aside"
      hint="A set-aside run stays on record but leaves comparisons, progress and assessments." />
  );
}
