'use client';

import Link from 'next/link';
import useSWR from 'swr';
import { formatForce, formatPercent } from '@/lib/calc/units';
import type { RunFilterOptions, RunPage } from '@/lib/data/runs';
import { fetchJson } from '@/lib/http/fetch-json';
import { formatDateTime } from '@/lib/format/format-date';
import { useUrlState } from '../ui/use-url-state';

const FILTERS = [
  { key: 'methodId', label: 'Method', option: 'methods' },
  { key: 'lubricantId', label: 'Lubricant', option: 'lubricants' },
  { key: 'jointId', label: 'Joint', option: 'joints' },
  { key: 'cohortId', label: 'Cohort', option: 'cohorts' },
  { key: 'operatorId', label: 'Operator', option: 'operators' },
] as const;

const SORTS = [
  { key: 'recordedAt', label: 'Recorded' },
  { key: 'finalCv', label: 'CV' },
  { key: 'finalMeanN', label: 'Mean final load' },
  { key: 'passCount', label: 'Passes' },
] as const;

const STATUS_LABELS: Record<string, string> = { draft: 'Draft', recording: 'Recording', complete: 'Complete', set_aside: 'Set aside', needs_review: 'Needs review' };
/** The statuses the filter offers, in the order a person looks for them. */
const STATUS_FILTER = ['complete', 'needs_review', 'set_aside', 'recording'] as const;

export function RunsTable({ options, units }: { options: RunFilterOptions; units: 'si' | 'us' }) {
  const { params, update: setParam } = useUrlState(['page']);
  const query = params.toString();
  const { data, error, isLoading } = useSWR<RunPage>(`/api/runs${query ? `?${query}` : ''}`, fetchJson, { keepPreviousData: true });

  const sort = params.get('sort') ?? 'recordedAt';
  const dir = params.get('dir') ?? 'desc';
  const page = Number(params.get('page') ?? '1');
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  const ariaSort = (key: string) => (sort === key ? (dir === 'asc' ? 'ascending' : 'descending') : undefined);

  function sortBy(key: string) {
    setParam({ sort: key, dir: sort === key && dir === 'desc' ? 'asc' : 'desc' });
  }

  return (
    <div className="space-y-3">
      <form className="grid gap-3 rounded-card border border-rule bg-panel p-3 sm:grid-cols-3 lg:grid-cols-8" onSubmit={(e) => e.preventDefault()} aria-label="Filters">
        {FILTERS.map((filter) => (
          <label key={filter.key} className="text-sm">
            <span className="block text-muted">{filter.label}</span>
            <select value={params.get(filter.key) ?? ''} onChange={(e) => setParam({ [filter.key]: e.target.value })}
              className="mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1.5">
              <option value="">All</option>
              {options[filter.option].map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
            </select>
          </label>
        ))}
        <label className="text-sm">
          <span className="block text-muted">Status</span>
          <select value={params.get('status') ?? ''} onChange={(e) => setParam({ status: e.target.value })} className="mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1.5">
            <option value="">All</option>
            {STATUS_FILTER.map((status) => <option key={status} value={status}>{STATUS_LABELS[status]}</option>)}
          </select>
        </label>
        <label className="text-sm">
          <span className="block text-muted">From</span>
          <input type="date" value={params.get('from') ?? ''} onChange={(e) => setParam({ from: e.target.value })} className="mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1.5" />
        </label>
        <label className="text-sm">
          <span className="block text-muted">To</span>
          <input type="date" value={params.get('to') ?? ''} onChange={(e) => setParam({ to: e.target.value })} className="mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1.5" />
        </label>
      </form>

      <div aria-live="polite" className="text-sm">
        {error ? <p className="text-danger">The runs could not be loaded: {error.message}</p> : null}
        {data ? <p className="text-muted">{data.total} run{data.total === 1 ? '' : 's'}{isLoading ? ' · updating…' : ''}</p> : isLoading ? <p className="text-muted">Loading runs…</p> : null}
      </div>

      <div className="overflow-x-auto rounded-card border border-rule bg-panel">
        <table className="w-full text-sm">
          <thead className="bg-rule/40 text-left">
            <tr>
              <th aria-sort={ariaSort('recordedAt')} className="px-3 py-2"><SortButton label="Recorded" active={sort === 'recordedAt'} dir={dir} onClick={() => sortBy('recordedAt')} /></th>
              <th className="px-3 py-2">Operator</th>
              <th className="px-3 py-2">Joint</th>
              <th className="px-3 py-2">Method</th>
              <th className="px-3 py-2">Lubricant</th>
              <th className="px-3 py-2">Cohort</th>
              <th aria-sort={ariaSort('passCount')} className="px-3 py-2 text-right"><SortButton label="Passes" active={sort === 'passCount'} dir={dir} onClick={() => sortBy('passCount')} /></th>
              <th aria-sort={ariaSort('finalMeanN')} className="px-3 py-2 text-right"><SortButton label="Mean final load" active={sort === 'finalMeanN'} dir={dir} onClick={() => sortBy('finalMeanN')} /></th>
              <th aria-sort={ariaSort('finalCv')} className="px-3 py-2 text-right"><SortButton label="CV" active={sort === 'finalCv'} dir={dir} onClick={() => sortBy('finalCv')} /></th>
              <th className="px-3 py-2">Status</th>
            </tr>
          </thead>
          <tbody className="num">
            {data?.rows.map((run) => (
              <tr key={run.id} className="border-t border-rule hover:bg-rule/30">
                <td className="px-3 py-2"><Link href={`/runs/${run.id}`} className="font-medium underline decoration-rule underline-offset-4">{formatDateTime(run.recordedAt)}</Link></td>
                <td className="px-3 py-2">{run.operatorName}</td>
                <td className="px-3 py-2">{run.jointName}</td>
                <td className="px-3 py-2">{run.methodName}</td>
                <td className="px-3 py-2">{run.lubricantName}</td>
                <td className="px-3 py-2">{run.cohortName ?? '—'}</td>
                <td className="px-3 py-2 text-right">{run.passCount}</td>
                <td className="px-3 py-2 text-right">{run.finalMeanN === null ? '—' : formatForce(run.finalMeanN, units)}</td>
                <td className="px-3 py-2 text-right">{run.finalCv === null ? '—' : formatPercent(run.finalCv * 100)}</td>
                <td className="px-3 py-2">
                  {run.status === 'needs_review' ? (
                    <span className="rounded-full border border-caution bg-caution/15 px-2 py-0.5 text-xs font-semibold">{STATUS_LABELS.needs_review}</span>
                  ) : (STATUS_LABELS[run.status] ?? run.status)}
                </td>
              </tr>
            ))}
            {data && data.rows.length === 0 ? (
              <tr><td colSpan={10} className="px-3 py-8 text-center text-muted">No runs match these filters. Clear a filter, or record a run.</td></tr>
            ) : null}
          </tbody>
        </table>
      </div>

      <nav aria-label="Pages" className="flex items-center gap-2 text-sm">
        <button type="button" disabled={page <= 1} onClick={() => setParam({ page: String(page - 1) })} className="rounded-md border border-rule px-3 py-1.5 disabled:opacity-40">Previous</button>
        <span className="num">Page {page} of {pages}</span>
        <button type="button" disabled={page >= pages} onClick={() => setParam({ page: String(page + 1) })} className="rounded-md border border-rule px-3 py-1.5 disabled:opacity-40">Next</button>
        <span className="ml-auto text-muted">Sorted by {SORTS.find((s) => s.key === sort)?.label ?? sort}, {dir === 'asc' ? 'ascending' : 'descending'}</span>
      </nav>
    </div>
  );
}

function SortButton({ label, active, dir, onClick }: { label: string; active: boolean; dir: string; onClick: () => void }) {
  return (
    <button type="button" onClick={onClick} className="font-semibold">
      {label}{active ? (dir === 'asc' ? ' ▲' : ' ▼') : ''}
    </button>
  );
}
