'use client';

import { useActionState } from 'react';
import { decideOutcomeAction, recordValidityAction } from '@/app/(lab)/cohorts/[id]/trainees/[userId]/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { DEFAULT_SCOPES } from '@/lib/qualification/training-record';
import { DEFAULT_REFRESHER_LEAD_DAYS, MAX_REFRESHER_LEAD_DAYS } from '@/lib/qualification/refresher';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

interface OutcomeFormProps {
  cohortId: number;
  traineeId: number;
  outcome: { decision: 'pass' | 'not_yet'; scopes: string[]; version: number; overrideReason: string | null } | null;
  /** What is outstanding for a pass; when anything is, a pass needs an override reason. */
  outstanding: string[];
}

/** The decision (pass or not yet), the scopes it covers and, while anything is outstanding, the reason for a pass anyway. */
export function OutcomeForm({ cohortId, traineeId, outcome, outstanding }: OutcomeFormProps) {
  const [state, action, pending] = useActionState(decideOutcomeAction.bind(null, cohortId, traineeId), IDLE_FORM_STATE);
  const scopes = [...new Set([...DEFAULT_SCOPES, ...(outcome?.scopes ?? [])])];
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="space-y-2" noValidate>
      <input type="hidden" name="version" value={outcome?.version ?? 0} />
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="mb-1 font-medium">Decision</legend>
        <label className="flex items-center gap-2"><input type="radio" name="decision" value="pass" defaultChecked={outcome?.decision === 'pass'} /> Pass</label>
        <label className="flex items-center gap-2"><input type="radio" name="decision" value="not_yet" defaultChecked={outcome?.decision === 'not_yet'} /> Not yet</label>
      </fieldset>
      <FieldError id="decision-error" messages={state.fieldErrors?.decision} />
      <fieldset className="flex flex-wrap gap-4 text-sm" aria-describedby="scopes-error">
        <legend className="mb-1 font-medium">Scope</legend>
        {scopes.map((scope) => (
          <label key={scope} className="flex items-center gap-2"><input type="checkbox" name="scopes" value={scope} defaultChecked={outcome?.scopes.includes(scope) ?? false} /> {scope}</label>
        ))}
      </fieldset>
      <FieldError id="scopes-error" messages={state.fieldErrors?.scopes} />
      {outstanding.length ? (
        <label className="block text-sm">
          <span className="block font-medium">Reason for a pass with something outstanding</span>
          <span id="override-hint" className="block text-xs text-muted">A pass is refused without it; the reason is kept with the decision and in its history.</span>
          <textarea name="overrideReason" rows={2} maxLength={400} defaultValue={outcome?.overrideReason ?? ''} aria-describedby="override-hint override-error" className="mt-1 w-full rounded-md border border-rule bg-paper p-2" />
        </label>
      ) : null}
      <FieldError id="override-error" messages={state.fieldErrors?.overrideReason} />
      <div className="flex flex-wrap items-center gap-4">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-60">{pending ? 'Saving…' : 'Save the decision'}</button>
        <FormMessage status={state.status} message={state.fieldErrors && !state.fieldErrors.overrideReason ? null : state.message} />
      </div>
    </form>
  );
}

/** How long the cohort's records are valid (months) and when their refresher reminder goes out (days before the end). */
export function ValidityForm({ cohortId, traineeId, months, leadDays }: { cohortId: number; traineeId: number; months: number; leadDays: number }) {
  const [state, action, pending] = useActionState(recordValidityAction.bind(null, cohortId, traineeId), IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="flex flex-wrap items-end gap-3 text-sm" noValidate>
      <label className="block">
        <span className="block font-medium">Records from this cohort are valid for (months)</span>
        <input name="months" type="number" min={1} max={120} defaultValue={months} aria-describedby="months-error months-hint" className="mt-1 w-24 rounded-md border border-rule bg-paper px-2 py-1" />
      </label>
      <label className="block">
        <span className="block font-medium">Refresher reminder (days before the end)</span>
        <input name="leadDays" type="number" min={0} max={MAX_REFRESHER_LEAD_DAYS} defaultValue={leadDays} aria-describedby="lead-days-error lead-days-hint" className="mt-1 w-24 rounded-md border border-rule bg-paper px-2 py-1" />
      </label>
      <button type="submit" disabled={pending} className="rounded-md border border-rule px-3 py-1.5 hover:bg-rule/60 disabled:opacity-60">{pending ? 'Saving…' : 'Save'}</button>
      <p id="months-hint" className="w-full text-xs text-muted">36 months: requalification every three years is common practice in the trade (training default: set your own).</p>
      <p id="lead-days-hint" className="w-full text-xs text-muted">The trainee is e-mailed {DEFAULT_REFRESHER_LEAD_DAYS} days before a record runs out unless you set otherwise (training default: set your own).</p>
      <FieldError id="months-error" messages={state.fieldErrors?.months} />
      <FieldError id="lead-days-error" messages={state.fieldErrors?.leadDays} />
      <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
    </form>
  );
}
