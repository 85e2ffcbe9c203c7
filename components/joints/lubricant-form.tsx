'use client';

import Link from 'next/link';
import { useActionState, useState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';
import { useFieldErrors } from '../ui/use-field-errors';
import type { LubricantSummary } from '@/lib/data/joints';
import { FieldMessage, INPUT_CLASS, Section, TextField } from './form-controls';

type Action = (state: FormState, formData: FormData) => Promise<FormState>;

/** The lubricant form: name, nominal nut factor K (0.05–0.60) and notes. */
export function LubricantForm({ lubricant, action }: { lubricant?: LubricantSummary; action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const [name, setName] = useState(lubricant?.name ?? '');
  const [k, setK] = useState(lubricant ? String(lubricant.nominalNutFactor) : '');
  const [notes, setNotes] = useState(lubricant?.notes ?? '');
  // A server error leaves its field as soon as the field is edited.
  const { errors, onEdit } = useFieldErrors(state);
  return (
    <form action={formAction} onChange={onEdit} noValidate className="flex flex-col gap-5" aria-label={lubricant ? `Edit lubricant ${lubricant.name}` : 'New lubricant'}>
      {lubricant ? <input type="hidden" name="version" value={lubricant.version} /> : null}
      <FormMessage status={state.status} message={state.message} banner />
      <Section title="Lubricant">
        <div className="flex flex-wrap gap-4">
          <TextField label="Lubricant name" name="name" value={name} onChange={setName} errors={errors.name} width="w-80" />
          <TextField
            label="Nominal nut factor (K)"
            name="nominalNutFactor"
            value={k}
            onChange={setK}
            errors={errors.nominalNutFactor}
            width="w-24"
            inputMode="decimal"
            hint="0.05 to 0.60. Measured mean K across lubricants spans 0.086–0.52 (Handbook of Bolts and Bolted Joints, ch. 19); 0.20 when the condition is unknown (Shigley & Mischke, §8-8)."
          />
        </div>
        <label className="flex flex-col gap-1 text-sm font-medium text-ink">
          <span>Notes <span className="font-normal text-muted">(optional: maker, where K comes from)</span></span>
          <textarea name="notes" value={notes} onChange={(e) => setNotes(e.target.value)} rows={3} aria-describedby="lubricant-notes-msg" className={`max-w-2xl font-normal ${INPUT_CLASS}`} />
        </label>
        <FieldMessage id="lubricant-notes-msg" messages={errors.notes} />
        <p className="text-xs text-muted">K is an empirical lumped factor, not a friction coefficient; a lower K than assumed over-loads the studs.</p>
      </Section>
      <div className="flex items-center gap-3">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">{pending ? 'Saving…' : 'Save lubricant'}</button>
        <Link href="/joints#lubricants" className="text-sm underline decoration-rule underline-offset-4">Back to the library</Link>
      </div>
    </form>
  );
}
