'use client';

import useSWR from 'swr';
import { formatNumber, type UnitSystem } from '@/lib/calc/units';
import type { CompareResponse } from '@/lib/data/compare';
import type { RunFilterOptions } from '@/lib/data/runs';
import { fetchJson } from '@/lib/http/fetch-json';
import { useUrlState } from '../ui/use-url-state';
import { CompareCharts } from './compare-charts';
import { BY_CHOICES, CompareFilters, type ByChoice } from './compare-filters';
import { CompareGroupsTable } from './compare-groups-table';
import { ComparePlanner } from './compare-planner';
import { CompareTests } from './compare-tests';
import { FreezeComparison } from './freeze-comparison';

const SOURCE_WORDS = { measured: 'measured', simulated: 'simulated', both: 'measured and simulated' } as const;

export function CompareView({ options, units = 'si' }: { options: RunFilterOptions; units?: UnitSystem }) {
  const { params, update } = useUrlState();
  const by = (params.get('by') ?? 'method') as ByChoice;
  const ids = (params.get('ids') ?? '').split(',').filter(Boolean);
  const query = params.toString();
  const key = by === 'runs' && ids.length < 2 ? null : `/api/compare${query ? `?${query}` : ''}`;
  const { data, error, isLoading } = useSWR<CompareResponse>(key, fetchJson, { keepPreviousData: true });
  const choice = BY_CHOICES.find((c) => c.key === by) ?? BY_CHOICES[0];
  const groupOptions = choice.option ? options[choice.option] : [];

  function toggleGroup(id: string) {
    const set = new Set(ids);
    if (set.has(id)) set.delete(id);
    else set.add(id);
    update({ ids: [...set].join(',') || null });
  }

  return (
    <div className="space-y-5">
      <form className="space-y-3 rounded-card border border-rule bg-panel p-4" onSubmit={(e) => e.preventDefault()} aria-label="What to compare">
        <CompareFilters options={options} params={params} update={update} />
        {by === 'runs' ? (
          <label className="block text-sm">
            <span className="block text-muted">Run numbers (two or more, separated by commas)</span>
            <input defaultValue={ids.join(', ')} onBlur={(e) => update({ ids: e.target.value.replace(/[^0-9,]/g, '') || null })} placeholder="e.g. 12, 40, 41"
              className="mt-1 w-full max-w-md rounded-md border border-rule bg-paper px-2 py-1.5" />
          </label>
        ) : (
          <fieldset>
            <legend className="text-sm text-muted">Groups (none ticked: the largest eight)</legend>
            <div className="mt-1 flex flex-wrap gap-2">
              {groupOptions.map((g) => {
                const on = ids.includes(String(g.id));
                return (
                  <label key={g.id} className={`cursor-pointer rounded-full border px-3 py-1 text-sm ${on ? 'border-accent bg-accent text-accent-ink' : 'border-rule'}`}>
                    <input type="checkbox" className="sr-only" checked={on} onChange={() => toggleGroup(String(g.id))} />
                    {g.name}
                  </label>
                );
              })}
            </div>
          </fieldset>
        )}
      </form>

      <div aria-live="polite" className="text-sm">
        {key === null ? <p className="text-muted">Name at least two runs to compare them.</p> : null}
        {error ? <p className="text-danger">The comparison could not be computed: {error.message}</p> : null}
        {isLoading ? <p className="text-muted">Computing the comparison…</p> : null}
        {data ? (
          <p className="text-muted">
            {data.totalRuns} {SOURCE_WORDS[data.source]} runs in {data.groups.length} groups.
            {data.simulatedLeftOut > 0 ? ` ${data.simulatedLeftOut} simulated runs match too and are left out; choose “Simulated runs only” to compare them on their own.` : ''}
          </p>
        ) : null}
      </div>

      {data ? (
        <>
          {data.warnings.length ? (
            <ul role="note" className="space-y-1 rounded-md border border-caution/60 bg-panel p-3 text-sm">
              {data.warnings.map((w) => <li key={w}>{w}</li>)}
            </ul>
          ) : null}
          <CompareGroupsTable groups={data.groups} units={units} />
          <CompareCharts data={data} onPickStudCount={(n) => update({ studCount: String(n) })} />
          <CompareTests data={data} />
          <ComparePlanner planner={data.planner} />
          {data.by === 'lubricant' ? <NutFactors data={data} /> : null}
          <FreezeComparison query={query} />
        </>
      ) : null}
    </div>
  );
}

export function NutFactors({ data }: { data: CompareResponse }) {
  return (
    <section aria-labelledby="k-heading" className="rounded-card border border-rule bg-panel p-4">
      <h2 id="k-heading" className="text-lg font-semibold">Nut factor by lubricant</h2>
      {data.nutFactors.length === 0 ? (
        <p className="mt-2 text-sm text-muted">No runs with recorded torque in these groups. Nut factors need runs whose steps carry the applied torque.</p>
      ) : (
        <div className="mt-2 relative overflow-x-auto">
        <table className="w-full text-sm">
          <thead className="text-left text-muted"><tr><th className="py-1">Lubricant</th><th className="text-right">Fitted K</th><th className="text-right">95 % CI</th><th className="text-right">Readings</th></tr></thead>
          <tbody className="num">
            {data.nutFactors.map((k) => (
              <tr key={k.key} className="border-t border-rule"><td className="py-1.5">{k.label}</td><td className="text-right">{formatNumber(k.k, 3)}</td><td className="text-right">{formatNumber(k.low, 3)} – {formatNumber(k.high, 3)}</td><td className="text-right">{k.n}</td></tr>
            ))}
          </tbody>
        </table>
        </div>
      )}
      <p className="mt-2 text-xs text-muted">K from T = K·D·F (short form, common practice), fitted through the origin over first-pass steps, where each stud is pulled up from snug so its load right after its own step is the load the torque produced.</p>
    </section>
  );
}
