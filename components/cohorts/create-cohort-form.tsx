'use client';

import { useActionState } from 'react';
import { createCohortAction } from '@/app/(lab)/cohorts/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

const input = 'mt-1 w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink';

export function CreateCohortForm() {
  const [state, action, pending] = useActionState(createCohortAction, IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="grid gap-x-4 gap-y-1 md:grid-cols-2" noValidate>
      <div>
        <label htmlFor="cohort-name" className="block text-sm font-medium">Course name</label>
        <input id="cohort-name" name="name" required aria-describedby="cohort-name-error" className={input} />
        <FieldError id="cohort-name-error" messages={state.fieldErrors?.name} />
      </div>
      <div>
        <label htmlFor="cohort-site" className="block text-sm font-medium">Site</label>
        <input id="cohort-site" name="site" required aria-describedby="cohort-site-error" className={input} />
        <FieldError id="cohort-site-error" messages={state.fieldErrors?.site} />
      </div>
      <div>
        <label htmlFor="cohort-start" className="block text-sm font-medium">First day</label>
        <input id="cohort-start" name="startsOn" type="date" required aria-describedby="cohort-start-error" className={input} />
        <FieldError id="cohort-start-error" messages={state.fieldErrors?.startsOn} />
      </div>
      <div>
        <label htmlFor="cohort-end" className="block text-sm font-medium">Last day</label>
        <input id="cohort-end" name="endsOn" type="date" required aria-describedby="cohort-end-error" className={input} />
        <FieldError id="cohort-end-error" messages={state.fieldErrors?.endsOn} />
      </div>
      <div className="md:col-span-2 flex items-center gap-4">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">
          {pending ? 'Creating…' : 'Create cohort'}
        </button>
        <FormMessage status={state.status} message={state.message} />
      </div>
    </form>
  );
}
