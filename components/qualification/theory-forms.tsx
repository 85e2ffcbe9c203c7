'use client';

import { useActionState } from 'react';
import { theoryPassMarkAction, theoryResultAction } from '@/app/(lab)/cohorts/[id]/trainees/[userId]/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import { keepValuesSubmit } from '../ui/keep-values-submit';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

const INPUT = 'mt-1 max-w-full rounded-md border border-rule bg-paper px-2 py-1';
const BUTTON = 'rounded-md border border-rule px-3 py-1.5 hover:bg-rule/60 disabled:opacity-60';

/** The cohort's theory pass mark in percent. */
export function PassMarkForm({ cohortId, traineeId, passMark, isDefault }: { cohortId: number; traineeId: number; passMark: number; isDefault: boolean }) {
  const [state, action, pending] = useActionState(theoryPassMarkAction.bind(null, cohortId, traineeId), IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="flex flex-wrap items-end gap-3 text-sm" noValidate>
      <label className="block">
        <span className="block font-medium">Theory pass mark (%)</span>
        <input name="passMark" inputMode="numeric" defaultValue={passMark} aria-describedby="pass-mark-hint pass-mark-error" className={`${INPUT} w-24`} />
      </label>
      <button type="submit" disabled={pending} className={BUTTON}>{pending ? 'Saving…' : 'Save the pass mark'}</button>
      <p id="pass-mark-hint" className="w-full text-xs text-muted">
        {isDefault ? `${passMark} %: training default: set your own.` : 'Set for this cohort.'} A score exactly at the pass mark passes.
      </p>
      <FieldError id="pass-mark-error" messages={state.fieldErrors?.passMark} />
      <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
    </form>
  );
}

/** One trainee's theory result: score in percent and the day it was taken; `version` is the result's as read (0 for none yet). */
export function TheoryResultForm({ cohortId, traineeId, score, takenOn, version }: { cohortId: number; traineeId: number; score: number | null; takenOn: string | null; version: number }) {
  const [state, action, pending] = useActionState(theoryResultAction.bind(null, cohortId, traineeId), IDLE_FORM_STATE);
  return (
    <form action={action} onSubmit={keepValuesSubmit(action)} className="flex flex-wrap items-end gap-3 text-sm" noValidate aria-label="Theory result">
      <input type="hidden" name="version" value={version} />
      <label className="block">
        <span className="block font-medium">Theory score (%)</span>
        <input name="score" inputMode="decimal" defaultValue={score ?? ''} aria-describedby="score-error" className={`${INPUT} w-24`} />
      </label>
      <label className="block">
        <span className="block font-medium">Taken on</span>
        <input name="takenOn" type="date" defaultValue={takenOn ?? new Date().toISOString().slice(0, 10)} aria-describedby="taken-on-error" className={INPUT} />
      </label>
      <button type="submit" disabled={pending} className={BUTTON}>{pending ? 'Saving…' : 'Save the theory result'}</button>
      <FieldError id="score-error" messages={state.fieldErrors?.score} />
      <FieldError id="taken-on-error" messages={state.fieldErrors?.takenOn} />
      <FormMessage status={state.status} message={state.fieldErrors ? null : state.message} />
    </form>
  );
}
