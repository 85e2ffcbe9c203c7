'use client';

import { useActionState } from 'react';
import { saveCriteriaAction } from '@/app/(lab)/cohorts/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import type { AssessmentCriteria } from '@/lib/assessment/criteria';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

const input = 'mt-1 w-28 rounded-md border border-rule bg-paper px-3 py-1.5 text-right text-ink num';

export function CriteriaForm({ cohortId, criteria, limits }: { cohortId: number; criteria: AssessmentCriteria & { version: number }; limits: Record<'bandPercent' | 'maxCvPercent' | 'maxYieldPercent', { min: number; max: number }> }) {
  const [state, action, pending] = useActionState(saveCriteriaAction.bind(null, cohortId), IDLE_FORM_STATE);
  const numberField = (name: 'bandPercent' | 'maxCvPercent' | 'maxYieldPercent', label: string, hint: string) => (
    <div>
      <label htmlFor={name} className="block text-sm font-medium">{label}</label>
      <span className="inline-flex items-center gap-1">
        <input id={name} name={name} inputMode="decimal" defaultValue={criteria[name]} aria-describedby={`${name}-hint ${name}-error`} className={input} />
        <span className="text-sm">%</span>
      </span>
      <p id={`${name}-hint`} className="text-xs text-muted">{hint} Allowed {limits[name].min}–{limits[name].max} %.</p>
      <FieldError id={`${name}-error`} messages={state.fieldErrors?.[name]} />
    </div>
  );
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="space-y-2" noValidate>
      <input type="hidden" name="version" value={criteria.version} />
      {numberField('bandPercent', 'Band: every final load within ± % of target', 'Default ±10 % (common practice).')}
      {numberField('maxCvPercent', 'Largest CV of the final loads', 'Default 5 % (training default: set your own).')}
      {numberField('maxYieldPercent', 'Largest stud load, % of minimum yield load', 'Default 70 % (top of the 40–70 % training range: set your own).')}
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="requirePattern" defaultChecked={criteria.requirePattern} />
        The prescribed pattern must be followed (check passes circular)
      </label>
      <div className="flex flex-wrap items-center gap-4 pt-1">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">
          {pending ? 'Saving…' : 'Save criteria'}
        </button>
        <FormMessage status={state.status} message={state.message} />
      </div>
    </form>
  );
}
