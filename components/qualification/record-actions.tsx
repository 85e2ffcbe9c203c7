'use client';

import { useActionState } from 'react';
import { issueRecordAction, reissueRecordAction, revokeRecordAction } from '@/app/(lab)/cohorts/[id]/trainees/[userId]/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

const BUTTON = 'rounded-md border border-rule px-3 py-1.5 text-sm hover:bg-rule/60 disabled:opacity-60';

export function IssueRecordButton({ cohortId, traineeId }: { cohortId: number; traineeId: number }) {
  const [state, action, pending] = useActionState(issueRecordAction.bind(null, cohortId, traineeId), IDLE_FORM_STATE);
  return (
    <form action={action} className="flex flex-wrap items-center gap-4">
      <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-60">{pending ? 'Issuing…' : 'Issue the record of training'}</button>
      <FormMessage status={state.status} message={state.message} />
    </form>
  );
}

/** Revoke with a reason, or reissue (a new code; the old one then shows as revoked). */
export function RecordActions({ cohortId, traineeId, recordId }: { cohortId: number; traineeId: number; recordId: number }) {
  const [revoked, revoke, revoking] = useActionState(revokeRecordAction.bind(null, cohortId, traineeId, recordId), IDLE_FORM_STATE);
  const [reissued, reissue, reissuing] = useActionState(reissueRecordAction.bind(null, cohortId, traineeId, recordId), IDLE_FORM_STATE);
  const reasonId = `revoke-reason-${recordId}`;
  return (
    <div className="mt-2 flex flex-wrap items-start gap-4">
      <form action={revoke} onSubmit={keepValuesSubmit(revoke)} className="space-y-1" noValidate>
        <label htmlFor={reasonId} className="block text-sm font-medium">Reason for revoking</label>
        <div className="flex flex-wrap gap-2">
          <input id={reasonId} name="reason" maxLength={400} aria-describedby={`${reasonId}-error`} className="w-64 rounded-md border border-rule bg-paper px-2 py-1 text-sm" />
          <button type="submit" disabled={revoking} className={BUTTON}>{revoking ? 'Revoking…' : 'Revoke'}</button>
        </div>
        <FieldError id={`${reasonId}-error`} messages={revoked.fieldErrors?.reason ?? (revoked.status === 'error' ? [revoked.message ?? ''] : undefined)} />
      </form>
      <form action={reissue} className="space-y-1 pt-6">
        <button type="submit" disabled={reissuing} className={BUTTON}>{reissuing ? 'Reissuing…' : 'Reissue with a new code'}</button>
        <FormMessage status={reissued.status} message={reissued.message} />
      </form>
    </div>
  );
}
