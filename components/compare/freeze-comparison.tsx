'use client';

import { useActionState, useState } from 'react';
import { freezeComparisonAction } from '@/app/(lab)/compare/saved/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

/** "Freeze this comparison": a title, then the results as shown are kept under a link of their own. */
export function FreezeComparison({ query }: { query: string }) {
  const [state, action, pending] = useActionState(freezeComparisonAction, IDLE_FORM_STATE);
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <button type="button" onClick={() => setOpen(true)} className="rounded-md border border-rule bg-panel px-3 py-1.5 text-sm font-medium">
        Freeze this comparison
      </button>
    );
  }
  return (
    <form action={action} className="space-y-2 rounded-card border border-rule bg-panel p-4" aria-labelledby="freeze-heading" noValidate>
      <h2 id="freeze-heading" className="font-semibold">Freeze this comparison</h2>
      <p className="text-sm text-muted">The results below are kept as they are now, with the runs they came from, under a link you can cite and share with colleagues who may see these runs.</p>
      <input type="hidden" name="query" value={query} />
      <label htmlFor="freeze-title" className="block text-sm font-medium">Title</label>
      <input id="freeze-title" name="title" required maxLength={200} aria-describedby="freeze-title-error" placeholder="e.g. Cross pattern against circular, spring cohort"
        className="w-full max-w-xl rounded-md border border-rule bg-paper px-2 py-1.5" />
      <FieldError id="freeze-title-error" messages={state.fieldErrors?.title} />
      {state.fieldErrors?.query ? <FieldError id="freeze-query-error" messages={state.fieldErrors.query} /> : null}
      <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
      <div className="flex gap-2">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-1.5 text-sm font-medium text-accent-ink disabled:opacity-60">{pending ? 'Freezing…' : 'Freeze'}</button>
        <button type="button" onClick={() => setOpen(false)} className="rounded-md border border-rule px-4 py-1.5 text-sm">Cancel</button>
      </div>
    </form>
  );
}
