'use client';

import { useActionState, useState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import type { StoredLimits } from '@/lib/data/calibration';
import { FormMessage } from '../ui/form-message';
import { Section, TextField } from '../joints/form-controls';

type Action = (state: FormState, form: FormData) => Promise<FormState>;

const FIELDS = [
  ['linearityPercent', 'Linearity, largest', '% of full scale'],
  ['hysteresisPercent', 'Hysteresis, largest', '% of full scale'],
  ['zeroReturnPercent', 'Zero return, largest', '% of full scale'],
  ['intervalPercent', 'Factor interval half-width, largest', '% of the factor'],
  ['intervalMonths', 'Months between calibrations', 'months'],
] as const;

/** The centre's acceptance limits (admin). */
export function LimitsForm({ limits, action }: { limits: StoredLimits; action: Action }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  const [values, setValues] = useState<Record<string, string>>(() => Object.fromEntries(FIELDS.map(([k]) => [k, String(limits[k])])));
  const errors = state.fieldErrors ?? {};
  return (
    <form action={formAction} noValidate className="flex flex-col gap-3" aria-label="Calibration limits">
      <FormMessage status={state.status} message={state.message} />
      <Section title="Acceptance limits">
        {limits.trainingDefault ? <p className="text-sm text-muted">training default: set your own</p> : null}
        <div className="flex flex-wrap gap-4">
          {FIELDS.map(([key, label, unit]) => (
            <TextField key={key} label={label} name={key} value={values[key] ?? ''} onChange={(v) => setValues({ ...values, [key]: v })} errors={errors[key]} unit={unit} width="w-20" inputMode="decimal" />
          ))}
        </div>
      </Section>
      <div>
        <button type="submit" disabled={pending} className="rounded-md border border-rule px-3 py-1.5 text-sm font-medium disabled:opacity-60">{pending ? 'Saving…' : 'Save limits'}</button>
      </div>
    </form>
  );
}
