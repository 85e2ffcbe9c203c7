'use client';

import { useActionState } from 'react';
import type { HardwareSetSummary, LubricantLotSummary } from '@/lib/data/hardware';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';
import { FieldMessage, INPUT_CLASS, Section } from './form-controls';

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

function Field({ label, name, errors, optional, multiline }: { label: string; name: string; errors?: string[]; optional?: boolean; multiline?: boolean }) {
  return (
    <label className="flex flex-col gap-1 text-sm font-medium text-ink">
      <span>{label}{optional ? <span className="font-normal text-muted"> (optional)</span> : null}</span>
      {multiline ? <textarea name={name} rows={2} className={`font-normal ${INPUT_CLASS}`} /> : <input name={name} className={`font-normal ${INPUT_CLASS}`} autoComplete="off" />}
      <FieldMessage id={`hw-${name}-msg`} messages={errors} />
    </label>
  );
}

function SetForm({ action }: { action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const errors = state.fieldErrors ?? {};
  return (
    <form action={formAction} className="grid gap-3 sm:grid-cols-3" aria-label="New hardware set">
      <Field label="Set name" name="name" errors={errors.name} />
      <Field label="Studs, nuts, washers" name="description" errors={errors.description} optional />
      <Field label="Condition" name="conditionNotes" errors={errors.conditionNotes} optional />
      <div className="flex items-center gap-3 sm:col-span-3">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-accent-ink disabled:opacity-60">Add set</button>
        <FormMessage status={state.status} message={state.message} />
      </div>
    </form>
  );
}

function ConditionForm({ set, action }: { set: HardwareSetSummary; action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  return (
    <form action={formAction} className="flex flex-wrap items-end gap-2" aria-label={`Condition of ${set.name}`}>
      <input name="conditionNotes" defaultValue={set.conditionNotes ?? ''} aria-label={`Condition of ${set.name}`} className={`min-w-56 flex-1 ${INPUT_CLASS}`} />
      <button type="submit" disabled={pending} className="rounded-md border border-rule px-3 py-1.5 text-sm">Save</button>
      <FormMessage status={state.status} message={state.message} />
    </form>
  );
}

function LotForm({ action, lubricants }: { action: Action; lubricants: { id: number; name: string }[] }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const errors = state.fieldErrors ?? {};
  return (
    <form action={formAction} className="grid gap-3 sm:grid-cols-3" aria-label="New lubricant lot">
      <label className="flex flex-col gap-1 text-sm font-medium text-ink">
        Lubricant
        <select name="lubricantId" className={`font-normal ${INPUT_CLASS}`}>
          {lubricants.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
        </select>
        <FieldMessage id="hw-lubricantId-msg" messages={errors.lubricantId} />
      </label>
      <Field label="Lot code" name="lotCode" errors={errors.lotCode} />
      <div className="flex items-end gap-3">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-accent-ink disabled:opacity-60">Add lot</button>
        <FormMessage status={state.status} message={state.message} />
      </div>
    </form>
  );
}

/** Hardware sets (use count, condition) and lubricant lots, each with a form to add one. */
export function HardwareForms({ sets, lots, lubricants, createSet, updateCondition, createLot }: {
  sets: HardwareSetSummary[];
  lots: LubricantLotSummary[];
  lubricants: { id: number; name: string }[];
  createSet: Action;
  updateCondition: Action[];
  createLot: Action;
}) {
  return (
    <>
      <Section title="Stud, nut and washer sets">
        {sets.length === 0 ? <p className="text-sm text-muted">No sets yet.</p> : (
          <table className="w-full text-sm">
            <thead className="text-left text-muted"><tr><th className="py-1">Set</th><th className="px-3 text-right">Runs so far</th><th className="px-3">Condition</th></tr></thead>
            <tbody>
              {sets.map((s, i) => (
                <tr key={s.id} className="border-t border-rule align-top">
                  <td className="py-2">{s.name}{s.description ? <span className="block text-xs text-muted">{s.description}</span> : null}</td>
                  <td className="num px-3 py-2 text-right">{s.useCount}</td>
                  <td className="px-3 py-1">{updateCondition[i] ? <ConditionForm set={s} action={updateCondition[i]} /> : null}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        <SetForm action={createSet} />
      </Section>
      <Section title="Lubricant lots">
        {lots.length === 0 ? <p className="text-sm text-muted">No lots yet.</p> : (
          <ul className="text-sm">{lots.map((l) => <li key={l.id}>{l.lubricantName}: lot {l.lotCode}</li>)}</ul>
        )}
        <LotForm action={createLot} lubricants={lubricants} />
      </Section>
    </>
  );
}
