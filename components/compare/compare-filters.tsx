'use client';

import type { RunFilterOptions } from '@/lib/data/runs';
import { TEST_QUESTIONS, COMPARISON_TESTS } from '@/lib/analysis/compare-types';

export const BY_CHOICES = [
  { key: 'method', label: 'Methods', option: 'methods' },
  { key: 'lubricant', label: 'Lubricants', option: 'lubricants' },
  { key: 'cohort', label: 'Cohorts', option: 'cohorts' },
  { key: 'trainee', label: 'Operators', option: 'operators' },
  { key: 'runs', label: 'Hand-picked runs', option: null },
  { key: 'hardwareUse', label: 'Hardware use count', option: null },
  { key: 'lubricantLot', label: 'Lubricant lots', option: null },
] as const;

export type ByChoice = (typeof BY_CHOICES)[number]['key'];

const field = 'mt-1 max-w-full rounded-md border border-rule bg-paper px-2 py-1.5';

/** The factors a comparison can be narrowed by (other than the grouping), each a single choice. */
const FACTOR_FILTERS = [
  { param: 'methodId', label: 'Method', all: 'All methods', option: 'methods' },
  { param: 'lubricantId', label: 'Lubricant', all: 'All lubricants', option: 'lubricants' },
  { param: 'cohortId', label: 'Cohort', all: 'All cohorts', option: 'cohorts' },
  { param: 'operatorId', label: 'Operator', all: 'All operators', option: 'operators' },
  { param: 'jointId', label: 'Joint', all: 'All joints', option: 'joints' },
] as const;

interface Props {
  options: RunFilterOptions;
  params: URLSearchParams;
  update: (changes: Record<string, string | null>) => void;
}

/** What to compare and which runs count: grouping, source, status, every factor, stud count, dates, passes, the planned outcome. */
export function CompareFilters({ options, params, update }: Props) {
  const by = (params.get('by') ?? 'method') as ByChoice;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-4">
        <label className="min-w-0 max-w-full text-sm" htmlFor="compare-by">
          <span className="block text-muted">Compare</span>
          <select id="compare-by" value={by} onChange={(e) => update({ by: e.target.value, ids: null })} className={field}>
            {BY_CHOICES.map((c) => <option key={c.key} value={c.key}>{c.label}</option>)}
          </select>
        </label>
        <label className="min-w-0 max-w-full text-sm" htmlFor="compare-source">
          <span className="block text-muted">Runs from</span>
          <select id="compare-source" value={params.get('source') ?? 'measured'} onChange={(e) => update({ source: e.target.value === 'measured' ? null : e.target.value })} className={field}>
            <option value="measured">Measured runs only</option>
            <option value="simulated">Simulated runs only</option>
            <option value="both">Measured and simulated, pooled</option>
          </select>
        </label>
        <label className="min-w-0 max-w-full text-sm" htmlFor="compare-status">
          <span className="block text-muted">Status</span>
          <select id="compare-status" value={params.get('status') ?? 'complete'} onChange={(e) => update({ status: e.target.value === 'complete' ? null : e.target.value })} className={field}>
            <option value="complete">Complete</option>
            <option value="set_aside">Set aside</option>
            <option value="both">Complete and set aside</option>
          </select>
        </label>
        {FACTOR_FILTERS.map((f) => (
          <label key={f.param} className="min-w-0 max-w-full text-sm">
            <span className="block text-muted">{f.label}</span>
            <select value={params.get(f.param) ?? ''} onChange={(e) => update({ [f.param]: e.target.value })} className={field}>
              <option value="">{f.all}</option>
              {options[f.option].map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
            </select>
          </label>
        ))}
        <label className="min-w-0 max-w-full text-sm">
          <span className="block text-muted">Studs</span>
          <input type="number" min={3} max={200} value={params.get('studCount') ?? ''} placeholder="any" onChange={(e) => update({ studCount: e.target.value })} className={`${field} w-20`} />
        </label>
        <label className="min-w-0 max-w-full text-sm">
          <span className="block text-muted">From</span>
          <input type="date" value={params.get('from') ?? ''} onChange={(e) => update({ from: e.target.value })} className={field} />
        </label>
        <label className="min-w-0 max-w-full text-sm">
          <span className="block text-muted">To</span>
          <input type="date" value={params.get('to') ?? ''} onChange={(e) => update({ to: e.target.value })} className={field} />
        </label>
        <label className="min-w-0 max-w-full text-sm">
          <span className="block text-muted">Passes</span>
          <input type="number" min={1} max={50} value={params.get('passCount') ?? ''} placeholder="any" onChange={(e) => update({ passCount: e.target.value })} className={`${field} w-20`} />
        </label>
      </div>
      <label className="block text-sm" htmlFor="compare-planned">
        <span className="block text-muted">Planned outcome (choose it before looking at the results; the other tests are exploratory)</span>
        <select id="compare-planned" value={params.get('planned') ?? 'welch-ln-cv'} onChange={(e) => update({ planned: e.target.value === 'welch-ln-cv' ? null : e.target.value })} className={`${field} max-w-full`}>
          {COMPARISON_TESTS.map((t) => <option key={t} value={t}>{TEST_QUESTIONS[t]}</option>)}
        </select>
      </label>
    </div>
  );
}
