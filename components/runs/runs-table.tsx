'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import type { KeyboardEvent, MouseEvent } from 'react';
import useSWR from 'swr';
import { formatForce, formatPercent } from '@/lib/calc/units';
import type { RunFilterOptions, RunPage } from '@/lib/data/runs';
import { fetchJson } from '@/lib/http/fetch-json';
import { formatDateTime } from '@/lib/format/format-date';
import { useUrlState } from '../ui/use-url-state';
import { RunsFilters } from './runs-filters';

const SORTS = [
  { key: 'recordedAt', label: 'Recorded' },
  { key: 'finalCv', label: 'CV' },
  { key: 'finalMeanN', label: 'Mean final load' },
  { key: 'passCount', label: 'Passes' },
] as const;

const STATUS_LABELS: Record<string, string> = { draft: 'Draft', recording: 'Recording', complete: 'Complete', set_aside: 'Set aside', needs_review: 'Needs review' };

export function RunsTable({ options, units }: { options: RunFilterOptions; units: 'si' | 'us' }) {
  const router = useRouter();
  // Every filter, sort and page change is a history entry, so Back returns to the previous view.
  const { params, update: setParam } = useUrlState(['page'], 'push');
  const query = params.toString();
  const { data, error, isLoading } = useSWR<RunPage>(`/api/runs${query ? `?${query}` : ''}`, fetchJson, { keepPreviousData: true });

  const sort = params.get('sort') ?? 'recordedAt';
  const dir = params.get('dir') ?? 'desc';
  const page = Number(params.get('page') ?? '1');
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  const ariaSort = (key: string) => (sort === key ? (dir === 'asc' ? 'ascending' : 'descending') : 'none');

  function sortBy(key: string) {
    setParam({ sort: key, dir: sort === key && dir === 'desc' ? 'asc' : 'desc' });
  }

  // The whole row opens the report (mouse, or Enter on the focused row); the date cell stays a real
  // link for screen readers and for opening in a new tab.
  function openRow(event: MouseEvent | KeyboardEvent, id: number) {
    if ((event.target as HTMLElement).closest('a, button')) return;
    if ('key' in event && event.key !== 'Enter') return;
    router.push(`/runs/${id}`);
  }

  return (
    <div className="space-y-3">
      <RunsFilters params={params} options={options} onChange={setParam} />

      <div aria-live="polite" className="text-sm">
        {error ? <p className="text-danger">The runs could not be loaded: {error.message}</p> : null}
        {data ? <p className="text-muted">{data.total} run{data.total === 1 ? '' : 's'}{isLoading ? ' · updating…' : ''}</p> : isLoading ? <p className="text-muted">Loading runs…</p> : null}
      </div>

      <div className="relative overflow-x-auto rounded-card border border-rule bg-panel">
        <table className="w-full min-w-[42rem] text-sm">
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
              <tr key={run.id} tabIndex={0} onClick={(e) => openRow(e, run.id)} onKeyDown={(e) => openRow(e, run.id)}
                className="cursor-pointer border-t border-rule hover:bg-rule/30 focus:bg-rule/30 focus:outline focus:outline-2 focus:outline-accent">
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
    <button type="button" onClick={onClick} className="inline-flex items-center gap-1 font-semibold" title={`Sort by ${label.toLowerCase()}`}>
      {label}
      <span aria-hidden="true" className={active ? '' : 'text-muted'}>{active ? (dir === 'asc' ? '▲' : '▼') : '↕'}</span>
    </button>
  );
}
