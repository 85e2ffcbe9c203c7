'use client';

import { useActionState } from 'react';
import { retryJobAction } from '@/app/(lab)/admin/jobs/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { FormMessage } from '../ui/form-message';

/** "Retry" for one failed job. */
export function RetryJobButton({ jobId }: { jobId: number }) {
  const [state, action, pending] = useActionState(retryJobAction.bind(null, jobId), IDLE_FORM_STATE);
  return (
    <form action={action} className="flex flex-wrap items-center gap-2">
      <button type="submit" disabled={pending} className="rounded-md border border-rule px-2 py-1 hover:bg-rule/60 disabled:opacity-60">{pending ? 'Retrying…' : 'Retry'}</button>
      <FormMessage status={state.status} message={state.message} />
    </form>
  );
}
