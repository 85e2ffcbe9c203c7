'use client';

import Link from 'next/link';
import { startTransition, useActionState, useState, type FormEvent } from 'react';
import { useSavedPayload } from './use-saved-payload';
import { saveSimulatedRunAction } from '@/app/(lab)/record/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { RecordFormState } from '@/app/(lab)/record/actions';
import { headerPayload, type HeaderErrors, type HeaderState } from './run-header-fields';

const GASKETS = [
  { value: 'soft', label: 'Soft (strong elastic interaction)' },
  { value: 'medium', label: 'Medium' },
  { value: 'stiff', label: 'Stiff (little interaction)' },
] as const;

/** "Simulate": one run of the chosen joint, method and lubricant from the tightening simulator, saved like any other run. */
export function SimulatePanel({ header, onHeaderErrors }: { header: HeaderState; onHeaderErrors: (e: HeaderErrors) => void }) {
  const [gasket, setGasket] = useState<(typeof GASKETS)[number]['value']>('medium');
  const [seed, setSeed] = useState(() => String(1 + Math.floor(Math.random() * 999_999)));
  const { isSaved, markSaved } = useSavedPayload();
  const [state, formAction, pending] = useActionState(async (prev: RecordFormState, formData: FormData) => {
    const result = await saveSimulatedRunAction(prev, formData);
    if (result.status === 'ok') markSaved(formData);
    onHeaderErrors(result.fieldErrors ?? {});
    return result;
  }, IDLE_FORM_STATE);
  const payload = JSON.stringify({ header: headerPayload(header), gasket, seed });
  // Submitted in a transition rather than through <form action>, so React does not reset the
  // form's fields after the action (the choices stay as the person left them).
  function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    startTransition(() => formAction(data));
  }
  return (
    <form onSubmit={onSubmit} className="space-y-3">
      <input type="hidden" name="payload" value={payload} />
      <p className="text-sm text-muted">
        The simulator tightens the joint stud by stud with the method above: a nut factor that scatters from stud to stud, and elastic interaction that relaxes
        studs tightened earlier. The run is saved as a simulated run, so it can be compared like any other. Its figures are a model, not a measurement.
      </p>
      <div className="flex flex-wrap items-end gap-4">
        <label className="text-sm" htmlFor="simulate-gasket">
          <span className="block font-medium">Gasket</span>
          <select id="simulate-gasket" value={gasket} onChange={(e) => setGasket(e.target.value as typeof gasket)} className="mt-1 max-w-full rounded-md border border-rule bg-paper px-2 py-1.5">
            {GASKETS.map((g) => <option key={g.value} value={g.value}>{g.label}</option>)}
          </select>
        </label>
        <label className="text-sm" htmlFor="simulate-seed">
          <span className="block font-medium">Seed</span>
          <input id="simulate-seed" inputMode="numeric" value={seed} onChange={(e) => setSeed(e.target.value)} aria-describedby="simulate-feedback" className="mt-1 w-32 rounded-md border border-rule bg-paper px-2 py-1.5" />
        </label>
        <button type="submit" disabled={pending || isSaved(payload)} className="rounded-md bg-accent px-4 py-2 text-accent-ink disabled:opacity-60">
          {pending ? 'Simulating…' : isSaved(payload) ? 'Saved: change the seed for another run' : 'Simulate and save'}
        </button>
      </div>
      <p className="text-xs text-muted">The same seed gives the same run.</p>
      <div id="simulate-feedback" aria-live="polite" className="text-sm">
        {state.fieldErrors?.seed?.map((e) => <p key={e} className="text-danger">{e}</p>)}
        {state.message ? <p className={state.status === 'ok' ? 'text-good' : 'text-danger'}>{state.message}</p> : null}
        {state.status === 'ok' && state.data?.runId ? <Link href={`/runs/${state.data?.runId}`} className="underline underline-offset-4">Open run {state.data?.runId}</Link> : null}
      </div>
    </form>
  );
}
