'use client';

import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useActionState, useEffect, useRef, useState } from 'react';
import { setPasswordAction } from '@/app/(auth)/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

const input = 'mt-1 w-full rounded-md border border-rule bg-paper px-3 py-2 text-ink';

export function SetPasswordForm({ token, purpose, email, name, minLength }: { token: string; purpose: 'invite' | 'reset'; email: string; name: string | null; minLength: number }) {
  const [state, action, pending] = useActionState(setPasswordAction.bind(null, token, purpose), IDLE_FORM_STATE);
  const password = useRef('');
  const router = useRouter();
  const [signInError, setSignInError] = useState<string | null>(null);

  useEffect(() => {
    if (state.status !== 'ok' || !state.data?.email) return;
    void signIn('credentials', { email: state.data.email, password: password.current, redirect: false }).then((result) => {
      if (!result || result.error) {
        setSignInError('Your password is set, but signing in failed. Go to the sign-in page and sign in with it.');
        return;
      }
      router.replace('/');
      router.refresh();
    });
  }, [state, router]);

  return (
    <form action={action} onSubmit={(event) => {
      password.current = String(new FormData(event.currentTarget).get('password') ?? '');
      keepValuesSubmit(action)(event);
    }} className="mt-6 space-y-3" noValidate>
      <div>
        <span className="block text-sm font-medium">E-mail</span>
        <p className="mt-1 text-sm">{email}</p>
      </div>
      {purpose === 'invite' ? (
        <div>
          <label htmlFor="name" className="block text-sm font-medium">Your name</label>
          <input id="name" name="name" autoComplete="name" defaultValue={name ?? ''} aria-describedby="name-error" className={input} />
          <FieldError id="name-error" messages={state.fieldErrors?.name} />
        </div>
      ) : null}
      <div>
        <label htmlFor="password" className="block text-sm font-medium">New password</label>
        <input id="password" name="password" type="password" autoComplete="new-password" minLength={minLength} required aria-describedby="password-hint password-error" className={input} />
        <p id="password-hint" className="mt-1 text-xs text-muted">At least {minLength} characters. A few unrelated words are easy to remember and hard to guess.</p>
        <FieldError id="password-error" messages={state.fieldErrors?.password} />
      </div>
      <div>
        <label htmlFor="confirm" className="block text-sm font-medium">Type it again</label>
        <input id="confirm" name="confirm" type="password" autoComplete="new-password" required aria-describedby="confirm-error" className={input} />
        <FieldError id="confirm-error" messages={state.fieldErrors?.confirm} />
      </div>
      <FormMessage status={signInError ? 'error' : state.status} message={signInError ?? state.message} />
      <button type="submit" disabled={pending || state.status === 'ok'} className="w-full rounded-md bg-accent px-4 py-2 font-medium text-accent-ink disabled:opacity-60">
        {pending ? 'Saving…' : 'Set password and sign in'}
      </button>
    </form>
  );
}
