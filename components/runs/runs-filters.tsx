'use client';

import { useState } from 'react';
import type { RunFilterOptions } from '@/lib/data/runs';

const SELECTS = [
  { key: 'methodId', label: 'Method', option: 'methods' },
  { key: 'lubricantId', label: 'Lubricant', option: 'lubricants' },
  { key: 'jointId', label: 'Joint', option: 'joints' },
  { key: 'cohortId', label: 'Cohort', option: 'cohorts' },
  { key: 'operatorId', label: 'Operator', option: 'operators' },
] as const;

/** The statuses the filter offers, in the order a person looks for them. */
const STATUSES = [
  { value: 'complete', label: 'Complete' },
  { value: 'needs_review', label: 'Needs review' },
  { value: 'set_aside', label: 'Set aside' },
  { value: 'recording', label: 'Recording' },
] as const;

const DATES = [
  { key: 'from', label: 'From' },
  { key: 'to', label: 'To' },
] as const;

interface Chip {
  key: string;
  text: string;
}

/** The filters that are set, each as "Label: value" (the chips above the table). */
export function activeFilterChips(params: URLSearchParams, options: RunFilterOptions): Chip[] {
  const chips: Chip[] = [];
  for (const filter of SELECTS) {
    const id = params.get(filter.key);
    if (!id) continue;
    const name = options[filter.option].find((o) => String(o.id) === id)?.name ?? id;
    chips.push({ key: filter.key, text: `${filter.label}: ${name}` });
  }
  const status = STATUSES.find((s) => s.value === params.get('status'));
  if (status) chips.push({ key: 'status', text: `Status: ${status.label}` });
  for (const date of DATES) {
    const value = params.get(date.key);
    if (value) chips.push({ key: date.key, text: `${date.label}: ${value}` });
  }
  return chips;
}

/**
 * The runs filters. On a phone they fold behind a "Filters" button and the ones in use show as chips
 * (each removable); from the small breakpoint up the form is always open.
 */
export function RunsFilters({ params, options, onChange }: { params: URLSearchParams; options: RunFilterOptions; onChange: (changes: Record<string, string | null>) => void }) {
  const [open, setOpen] = useState(false);
  const chips = activeFilterChips(params, options);
  const field = 'mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1.5';
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <button type="button" aria-expanded={open} aria-controls="runs-filters" onClick={() => setOpen(!open)} className="rounded-md border border-rule px-3 py-1.5 sm:hidden">
          Filters{chips.length ? ` (${chips.length})` : ''} {open ? '▴' : '▾'}
        </button>
        {chips.length ? (
          <ul aria-label="Filters in use" className="flex flex-wrap gap-2">
            {chips.map((chip) => (
              <li key={chip.key}>
                <button type="button" onClick={() => onChange({ [chip.key]: null })} aria-label={`Remove filter ${chip.text}`}
                  className="rounded-full border border-rule bg-panel px-3 py-1">
                  {chip.text} <span aria-hidden="true">×</span>
                </button>
              </li>
            ))}
          </ul>
        ) : null}
      </div>
      <form id="runs-filters" onSubmit={(e) => e.preventDefault()} aria-label="Filters"
        className={`${open ? 'grid' : 'hidden'} gap-3 rounded-card border border-rule bg-panel p-3 sm:grid sm:grid-cols-3 lg:grid-cols-8`}>
        {SELECTS.map((filter) => (
          <label key={filter.key} className="min-w-0 text-sm">
            <span className="block text-muted">{filter.label}</span>
            <select value={params.get(filter.key) ?? ''} onChange={(e) => onChange({ [filter.key]: e.target.value })} className={field}>
              <option value="">All</option>
              {options[filter.option].map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
            </select>
          </label>
        ))}
        <label className="min-w-0 text-sm">
          <span className="block text-muted">Status</span>
          <select value={params.get('status') ?? ''} onChange={(e) => onChange({ status: e.target.value })} className={field}>
            <option value="">All</option>
            {STATUSES.map((status) => <option key={status.value} value={status.value}>{status.label}</option>)}
          </select>
        </label>
        {DATES.map((date) => (
          <label key={date.key} className="min-w-0 text-sm">
            <span className="block text-muted">{date.label}</span>
            <input type="date" value={params.get(date.key) ?? ''} onChange={(e) => onChange({ [date.key]: e.target.value })} className={field} />
          </label>
        ))}
      </form>
    </div>
  );
}
