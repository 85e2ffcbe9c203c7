'use client';

import { signOut } from 'next-auth/react';
import { useState, useTransition } from 'react';
import { signOutEverywhereAction } from '@/app/(lab)/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';

const BUTTON = 'rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60';

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: '/sign-in' })} className={BUTTON}>
      Sign out
    </button>
  );
}

/** Ends every session of the signed-in person on the server (other browsers and devices too), then this one. */
export function SignOutEverywhereButton() {
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const run = () =>
    startTransition(async () => {
      const state = await signOutEverywhereAction(IDLE_FORM_STATE, new FormData());
      if (state.status === 'ok') await signOut({ callbackUrl: '/sign-in' });
      else setError(state.message);
    });
  return (
    <>
      <button type="button" onClick={run} disabled={pending} title="Ends your sessions in every browser and device" className={BUTTON}>
        Sign out everywhere
      </button>
      {error ? <span role="alert" className="text-danger">{error}</span> : null}
    </>
  );
}
