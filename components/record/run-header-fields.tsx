'use client';

import { useState } from 'react';
import { currentCohortOf, utcToday } from '@/lib/cohorts/current-cohort';
import type { RecordOperator, RecordOptions } from '@/lib/data/record';

export interface HeaderState {
  jointId: string;
  methodId: string;
  lubricantId: string;
  operatorId: string;
  cohortId: string;
  recordedAt: string;
  notes: string;
  hardwareSetId: string;
  lubricantLotId: string;
  gasketCondition: string;
}

export type HeaderErrors = Record<string, string[] | undefined>;

const CONTROL = 'mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1.5 text-ink aria-[invalid=true]:border-danger';

/** The run header shared by the three ways in. Errors from the server show beside each field. */
export function RunHeaderFields({ options, value, onChange, errors }: { options: RecordOptions; value: HeaderState; onChange: (next: HeaderState) => void; errors: HeaderErrors }) {
  const operator = options.operators.find((o) => String(o.id) === value.operatorId);
  const cohorts = options.cohorts.filter((c) => operator?.cohortIds.includes(c.id));
  // What the form changed on its own, and why (an operator who is not in the chosen cohort).
  const [cohortNote, setCohortNote] = useState('');
  const set = (key: keyof HeaderState) => (e: React.ChangeEvent<HTMLSelectElement | HTMLInputElement | HTMLTextAreaElement>) => {
    const next = { ...value, [key]: e.target.value };
    if (key === 'cohortId') setCohortNote('');
    if (key === 'lubricantId') next.lubricantLotId = '';
    if (key === 'operatorId') {
      const op = options.operators.find((o) => String(o.id) === e.target.value);
      const change = cohortForOperator(options, op, value.cohortId);
      if (change) {
        next.cohortId = change.cohortId;
        setCohortNote(change.note);
      }
    }
    onChange(next);
  };
  const field = (key: keyof HeaderState, label: string, control: React.ReactNode) => (
    <label className="min-w-0 text-sm">
      <span id={`header-${key}-label`} className="block font-medium">{label}</span>
      {control}
      <span aria-live="polite" id={`header-${key}-error`} className="block text-danger">
        {errors[key]?.[0] ?? ''}
      </span>
    </label>
  );
  const select = (key: keyof HeaderState, items: Array<{ id: number; name: string }>, extra?: React.ReactNode) => (
    <select name={key} value={value[key]} onChange={set(key)} aria-labelledby={`header-${key}-label`} className={CONTROL} aria-invalid={errors[key] ? true : undefined} aria-describedby={`header-${key}-error`}>
      {extra}
      {items.map((item) => (
        <option key={item.id} value={item.id}>
          {item.name}
        </option>
      ))}
    </select>
  );
  return (
    <fieldset className="grid min-w-0 gap-3 rounded-card border border-rule bg-panel p-4 sm:grid-cols-2 lg:grid-cols-4">
      <legend className="px-1 text-sm font-semibold">Run header</legend>
      {field('jointId', 'Joint', select('jointId', options.joints.map((j) => ({ id: j.id, name: `${j.name} (${j.studCount} studs)` }))))}
      {field('methodId', 'Method', select('methodId', options.methods))}
      {field('lubricantId', 'Lubricant', select('lubricantId', options.lubricants))}
      {field('operatorId', 'Operator', select('operatorId', options.operators))}
      <div>
        {field('cohortId', 'Cohort', select('cohortId', cohorts, <option value="">No cohort</option>))}
        <p aria-live="polite" className="text-xs text-caution" data-testid="cohort-note">{cohortNote}</p>
      </div>
      {field('hardwareSetId', 'Studs, nuts and washers (optional)', select('hardwareSetId', options.hardwareSets.map((h) => ({ id: h.id, name: `${h.name} (used ${h.useCount} times)` })), <option value="">Not recorded</option>))}
      {field('lubricantLotId', 'Lubricant lot (optional)', select('lubricantLotId', options.lubricantLots.filter((l) => String(l.lubricantId) === value.lubricantId), <option value="">Not recorded</option>))}
      {field('gasketCondition', 'Gasket (optional)', select('gasketCondition', [], <><option value="">Not recorded</option><option value="new">New</option><option value="reused">Reused</option></>))}
      {field('recordedAt', 'Recorded at (UTC)', <input type="datetime-local" aria-labelledby="header-recordedAt-label" name="recordedAt" value={value.recordedAt} onChange={set('recordedAt')} className={CONTROL} aria-invalid={errors.recordedAt ? true : undefined} />)}
      <div className="sm:col-span-2">
        {field('notes', 'Notes (optional)', <input type="text" name="notes" value={value.notes} onChange={set('notes')} maxLength={2000} placeholder="e.g. gauge 5 re-zeroed before the run" className={CONTROL} />)}
      </div>
    </fieldset>
  );
}

/** The header as the server's zod schema reads it. */
export function headerPayload(h: HeaderState) {
  return { ...h, cohortId: h.cohortId === '' ? null : h.cohortId, notes: h.notes.trim() === '' ? null : h.notes };
}

/** The cohort a header starts in for this operator: their current cohort (as Home calls it), or none. */
export function defaultCohortId(options: RecordOptions, operator: RecordOperator | undefined): string {
  const current = currentCohortOf(options.cohorts.filter((c) => operator?.cohortIds.includes(c.id)), utcToday());
  return current ? String(current.id) : '';
}

/**
 * When the operator changes and is not in the chosen cohort, the cohort moves to the operator's
 * current cohort (or none) with a sentence saying so; null when the chosen cohort still fits.
 */
function cohortForOperator(options: RecordOptions, operator: RecordOperator | undefined, cohortId: string): { cohortId: string; note: string } | null {
  if (cohortId === '' || operator?.cohortIds.includes(Number(cohortId))) return null;
  const nameOf = (id: string) => options.cohorts.find((c) => String(c.id) === id)?.name ?? 'the cohort';
  const next = defaultCohortId(options, operator);
  const who = operator?.name ?? 'This operator';
  return {
    cohortId: next,
    note: next
      ? `Cohort changed to “${nameOf(next)}”: ${who} is not in “${nameOf(cohortId)}”.`
      : `Cohort set to none: ${who} is not in “${nameOf(cohortId)}” nor in another cohort you may record in.`,
  };
}
