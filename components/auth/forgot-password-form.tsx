'use client';

import { useActionState } from 'react';
import { requestResetAction } from '@/app/(auth)/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

export function ForgotPasswordForm() {
  const [state, action, pending] = useActionState(requestResetAction, IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="mt-6 space-y-3" noValidate>
      <div>
        <label htmlFor="email" className="block text-sm font-medium">E-mail</label>
        <input id="email" name="email" type="email" autoComplete="username" required aria-describedby="email-error"
          className="mt-1 w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink" />
        <FieldError id="email-error" messages={state.fieldErrors?.email} />
      </div>
      <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
      <button type="submit" disabled={pending} className="w-full rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">
        {pending ? 'Sending…' : 'Send a reset link'}
      </button>
    </form>
  );
}
