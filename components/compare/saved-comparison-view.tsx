import Link from 'next/link';
import type { ReactNode } from 'react';
import type { UnitSystem } from '@/lib/calc/units';
import type { SavedComparisonView as SavedView } from '@/lib/data/saved-comparisons';
import { TEST_QUESTIONS, type ComparisonTestId } from '@/lib/analysis/compare-types';
import { formatDateTime } from '@/lib/format/format-date';
import { CompareCharts } from './compare-charts';
import { CompareGroupsTable } from './compare-groups-table';
import { ComparePlanner } from './compare-planner';
import { CompareTests } from './compare-tests';
import { NutFactors } from './compare-view';

const QUERY_WORDS: Record<string, string> = {
  by: 'Compared by', ids: 'Groups chosen', source: 'Runs', status: 'Status', methodId: 'Method', lubricantId: 'Lubricant', cohortId: 'Cohort',
  operatorId: 'Operator', jointId: 'Joint', studCount: 'Stud count', from: 'From', to: 'To', passCount: 'Passes', planned: 'Planned outcome',
};

/** A filter's value in words: the planned outcome as its question, codes without underscores. */
function valueWords(name: string, value: unknown): string {
  if (name === 'planned') return TEST_QUESTIONS[value as ComparisonTestId] ?? String(value);
  if (Array.isArray(value)) return value.join(', ');
  return String(value).replace(/_/g, ' ');
}

/**
 * A saved comparison: the results exactly as frozen, its citation, its facts and the data package;
 * a warning when its runs changed after it was frozen. `review`: opened through a review link
 * (no link to the live Compare page; `children` holds the author's review links otherwise).
 */
export function SavedComparisonView({ saved, packageHref, review = false, units = 'si', children }: { saved: SavedView; packageHref: string; review?: boolean; units?: UnitSystem; children?: ReactNode }) {
  const { results } = saved;
  const filters = Object.entries(saved.query).filter(([, v]) => v !== undefined);
  return (
    <div className="space-y-5">
      <div>
        <p className="text-sm text-muted">Saved comparison</p>
        <h1 className="text-2xl font-semibold">{saved.title}</h1>
        <p className="text-sm text-muted">Frozen by {saved.author} on {formatDateTime(saved.createdAt)}. The results below are as they were then, from {saved.runCount} runs.</p>
      </div>
      {saved.dataChanged ? (
        <p role="alert" className="rounded-md border border-caution/60 bg-panel p-3 text-sm">
          Some of these runs changed after the comparison was frozen (a run, its steps or readings were edited, set aside or restored). The results below are as frozen; the data package holds the runs as they are now, so its data hash differs from the one cited.
        </p>
      ) : null}

      <section aria-labelledby="cite-heading" className="space-y-3 rounded-card border border-rule bg-panel p-4 text-sm">
        <h2 id="cite-heading" className="text-lg font-semibold">Cite and reproduce</h2>
        <p className="break-words font-mono text-xs" aria-label="Citation">{saved.citation}</p>
        <dl className="grid gap-x-4 gap-y-1 sm:grid-cols-[max-content_1fr]">
          <dt className="text-muted">Software</dt><dd>{saved.softwareVersion}</dd>
          <dt className="text-muted">Data sha256</dt><dd className="break-all font-mono text-xs">{saved.dataSha256}</dd>
          {filters.map(([name, value]) => (
            <div key={name} className="contents"><dt className="text-muted">{QUERY_WORDS[name] ?? name}</dt><dd>{valueWords(name, value)}</dd></div>
          ))}
        </dl>
        <p>
          The data package holds the runs, steps and readings as tables with their descriptions and units, a checksum of every file, and a Python script (numpy, scipy, statsmodels) that recomputes the typical run CV per group, both analyses of variance on the run CV and the CV ratio.
        </p>
        <div className="flex flex-wrap gap-3">
          <a href={packageHref} download className="rounded-md bg-accent px-4 py-1.5 font-medium text-accent-ink">Download the data package</a>
          {review ? null : <Link href={`/compare?${saved.liveSearch}`} className="rounded-md border border-rule px-4 py-1.5">Open with today’s runs</Link>}
        </div>
      </section>
      {children}

      {results.warnings.length ? (
        <ul role="note" className="space-y-1 rounded-md border border-caution/60 bg-panel p-3 text-sm">
          {results.warnings.map((w) => <li key={w}>{w}</li>)}
        </ul>
      ) : null}
      <CompareGroupsTable groups={results.groups} units={units} />
      <CompareCharts data={results} />
      <CompareTests data={results} />
      <ComparePlanner planner={results.planner} />
      {results.by === 'lubricant' ? <NutFactors data={results} /> : null}
    </div>
  );
}
