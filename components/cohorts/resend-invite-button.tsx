'use client';

import { useActionState } from 'react';
import { resendInviteAction } from '@/app/(lab)/cohorts/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';
import { InviteLinks } from './invite-links';

/** "Resend invitation" for someone who has not set a password yet (a fresh link; the same limits apply). */
export function ResendInviteButton({ userId, cohortId, name }: { userId: number; cohortId: number | null; name: string }) {
  const [state, action, pending] = useActionState(resendInviteAction.bind(null, userId, cohortId), IDLE_FORM_STATE);
  return (
    <form action={action} className="space-y-1">
      <button type="submit" disabled={pending} aria-label={`Resend the invitation to ${name}`} className="rounded-md border border-rule px-2 py-0.5 text-xs hover:bg-rule/60 disabled:opacity-60">
        {pending ? 'Sending…' : 'Resend invitation'}
      </button>
      <FormMessage status={state.status} message={state.message} />
      <InviteLinks links={state.data?.handOver} />
    </form>
  );
}
