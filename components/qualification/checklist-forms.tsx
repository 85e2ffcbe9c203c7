'use client';

import { useActionState } from 'react';
import { checklistAction, checklistTickAction } from '@/app/(lab)/cohorts/[id]/trainees/[userId]/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { DEFAULT_CHECKLIST } from '@/lib/qualification/course-outcome';
import type { ChecklistEntryDto } from '@/lib/data/qualification/course-evidence';
import { formatDateTime } from '@/lib/format/format-date';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

const BUTTON = 'rounded-md border border-rule px-3 py-1.5 hover:bg-rule/60 disabled:opacity-60';

/**
 * The cohort's checklist: rename or retire items in force (retired items keep their ticks), add new
 * ones one per line. A cohort without a list is offered the starting list to edit.
 */
export function ChecklistEditor({ cohortId, traineeId, items }: { cohortId: number; traineeId: number; items: { id: number; label: string }[] }) {
  const [state, action, pending] = useActionState(checklistAction.bind(null, cohortId, traineeId), IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="space-y-2 text-sm" noValidate aria-label="Observation checklist of the cohort">
      {items.length ? (
        <ul className="space-y-1">
          {items.map((item) => (
            <li key={item.id} className="flex flex-wrap items-center gap-2">
              <input type="hidden" name="itemId" value={item.id} />
              <input name={`label-${item.id}`} defaultValue={item.label} aria-label={`Item: ${item.label}`} maxLength={120} className="w-80 max-w-full rounded-md border border-rule bg-paper px-2 py-1" />
              <label className="flex items-center gap-1"><input type="checkbox" name={`retire-${item.id}`} /> Retire</label>
            </li>
          ))}
        </ul>
      ) : null}
      <label className="block">
        <span className="block font-medium">{items.length ? 'Add items (one per line)' : 'Checklist items (one per line; a starting list to edit)'}</span>
        <textarea name="added" rows={items.length ? 2 : 5} defaultValue={items.length ? '' : DEFAULT_CHECKLIST.join('\n')} aria-describedby="checklist-error" className="mt-1 w-full rounded-md border border-rule bg-paper p-2" />
      </label>
      <FieldError id="checklist-error" messages={state.fieldErrors?.items ?? state.fieldErrors?.added} />
      <div className="flex flex-wrap items-center gap-4">
        <button type="submit" disabled={pending} className={BUTTON}>{pending ? 'Saving…' : 'Save the checklist'}</button>
        <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
      </div>
    </form>
  );
}

/** One checklist item for this trainee: observed or not, by whom and when, with an optional note. */
function TickForm({ cohortId, traineeId, entry }: { cohortId: number; traineeId: number; entry: ChecklistEntryDto }) {
  const [state, action, pending] = useActionState(checklistTickAction.bind(null, cohortId, traineeId), IDLE_FORM_STATE);
  const observed = entry.tick?.observed ?? false;
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="flex flex-wrap items-center gap-2" aria-label={entry.label} noValidate>
      <input type="hidden" name="itemId" value={entry.id} />
      <input type="hidden" name="observed" value={observed ? '0' : '1'} />
      <input type="hidden" name="version" value={entry.tick?.version ?? 0} />
      <span className="min-w-48 font-medium">{observed ? '✓ ' : ''}{entry.label}</span>
      {entry.tick ? <span className="text-xs text-muted">{observed ? 'observed' : 'un-ticked'} by {entry.tick.byName}, {formatDateTime(entry.tick.at)}{entry.tick.note ? `: “${entry.tick.note}”` : ''}</span> : null}
      <input name="note" placeholder="Note (optional)" aria-label={`Note on ${entry.label}`} maxLength={400} className="w-48 max-w-full rounded-md border border-rule bg-paper px-2 py-1" />
      <button type="submit" disabled={pending} className={BUTTON}>{observed ? 'Not observed' : 'Observed'}</button>
      <FormMessage status={state.status} message={state.fieldErrors?.note?.[0] ?? state.message} />
    </form>
  );
}

/** The trainee's ticks: items in force can be ticked; retired items show their kept tick. */
export function ChecklistTicks({ cohortId, traineeId, entries }: { cohortId: number; traineeId: number; entries: ChecklistEntryDto[] }) {
  return (
    <ul className="space-y-2 text-sm" aria-label="Observation checklist">
      {entries.map((entry) => (
        <li key={entry.id}>
          {entry.retired ? (
            <p className="text-muted">{entry.label} (retired from the checklist){entry.tick?.observed ? `: observed by ${entry.tick.byName}, ${formatDateTime(entry.tick.at)}` : ''}</p>
          ) : <TickForm cohortId={cohortId} traineeId={traineeId} entry={entry} />}
        </li>
      ))}
    </ul>
  );
}
