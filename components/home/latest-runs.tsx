import Link from 'next/link';
import { formatForce, formatPercent } from '@/lib/calc/units';
import type { RunRow } from '@/lib/data/runs';
import { formatDateTime } from '@/lib/format/format-date';
import { EmptyState } from '../ui/empty-state';

export function LatestRuns({ runs, units, title = 'Latest runs' }: { runs: RunRow[]; units: 'si' | 'us'; title?: string }) {
  return (
    <section aria-labelledby="latest-runs" className="rounded-card border border-rule bg-panel p-4">
      <h2 id="latest-runs" className="font-semibold">{title}</h2>
      {runs.length === 0 ? (
        <div className="mt-3">
          <EmptyState title="No runs yet">Record a run (upload a logger file or enter the loads by hand) and it appears here.</EmptyState>
        </div>
      ) : (
        <ul className="mt-2 divide-y divide-rule">
          {runs.map((run) => (
            <li key={run.id}>
              <Link href={`/runs/${run.id}`} className="flex flex-wrap items-baseline gap-x-4 gap-y-1 py-2 hover:bg-rule/30">
                <span className="num w-40 text-sm text-muted">{formatDateTime(run.recordedAt)}</span>
                <span className="font-medium">{run.operatorName}</span>
                <span className="text-sm">{run.methodName}</span>
                <span className="num ml-auto text-sm">
                  CV {run.finalCv === null ? '—' : formatPercent(run.finalCv * 100)} · mean{' '}
                  {run.finalMeanN === null ? '—' : formatForce(run.finalMeanN, units)}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
