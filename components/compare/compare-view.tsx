'use client';

import useSWR from 'swr';
import { formatNumber, formatPercent } from '@/lib/calc/units';
import type { CompareResponse } from '@/lib/data/compare';
import type { RunFilterOptions } from '@/lib/data/runs';
import { fetchJson } from '@/lib/http/fetch-json';
import { groupColour } from '@/lib/charts/palette';
import { useUrlState } from '../ui/use-url-state';
import { CompareCharts } from './compare-charts';

const BY_CHOICES = [
  { key: 'method', label: 'Methods', option: 'methods' },
  { key: 'lubricant', label: 'Lubricants', option: 'lubricants' },
  { key: 'cohort', label: 'Cohorts', option: 'cohorts' },
  { key: 'trainee', label: 'Operators', option: 'operators' },
  { key: 'runs', label: 'Hand-picked runs', option: null },
] as const;

const formatP = (p: number) => (p < 0.001 ? '< 0.001' : formatNumber(p, 2));

export function CompareView({ options }: { options: RunFilterOptions }) {
  const { params, update } = useUrlState();
  const by = (params.get('by') ?? 'method') as (typeof BY_CHOICES)[number]['key'];
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
        <div className="flex flex-wrap items-end gap-4">
          <label className="text-sm" htmlFor="compare-by">
            <span className="block text-muted">Compare</span>
            <select id="compare-by" value={by} onChange={(e) => update({ by: e.target.value, ids: null })} className="mt-1 rounded-md border border-rule bg-paper px-2 py-1.5">
              {BY_CHOICES.map((c) => <option key={c.key} value={c.key}>{c.label}</option>)}
            </select>
          </label>
          <label className="text-sm">
            <span className="block text-muted">Joint</span>
            <select value={params.get('jointId') ?? ''} onChange={(e) => update({ jointId: e.target.value })} className="mt-1 rounded-md border border-rule bg-paper px-2 py-1.5">
              <option value="">All joints</option>
              {options.joints.map((j) => <option key={j.id} value={j.id}>{j.name}</option>)}
            </select>
          </label>
          <label className="text-sm">
            <span className="block text-muted">From</span>
            <input type="date" value={params.get('from') ?? ''} onChange={(e) => update({ from: e.target.value })} className="mt-1 rounded-md border border-rule bg-paper px-2 py-1.5" />
          </label>
          <label className="text-sm">
            <span className="block text-muted">To</span>
            <input type="date" value={params.get('to') ?? ''} onChange={(e) => update({ to: e.target.value })} className="mt-1 rounded-md border border-rule bg-paper px-2 py-1.5" />
          </label>
          <label className="text-sm">
            <span className="block text-muted">Passes</span>
            <input type="number" min={1} max={50} value={params.get('passCount') ?? ''} placeholder="any" onChange={(e) => update({ passCount: e.target.value })} className="mt-1 w-20 rounded-md border border-rule bg-paper px-2 py-1.5" />
          </label>
        </div>
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
        {data ? <p className="text-muted">{data.totalRuns} complete runs in {data.groups.length} groups.</p> : null}
      </div>

      {data ? (
        <>
          {data.warnings.length ? (
            <ul role="note" className="space-y-1 rounded-md border border-caution/60 bg-panel p-3 text-sm">
              {data.warnings.map((w) => <li key={w}>{w}</li>)}
            </ul>
          ) : null}
          <section aria-labelledby="groups-heading" className="overflow-x-auto rounded-card border border-rule bg-panel p-4">
            <h2 id="groups-heading" className="text-lg font-semibold">Groups</h2>
            <table className="mt-2 w-full text-sm">
              <thead className="text-left text-muted">
                <tr><th className="py-1">Group</th><th className="text-right">Runs</th><th className="text-right">Studs</th><th className="text-right">Mean, % of target</th><th className="text-right">SD, % of target</th><th className="text-right">CV of final loads</th><th className="text-right">95 % CI of CV</th><th className="text-right">Mean run CV</th></tr>
              </thead>
              <tbody className="num">
                {data.groups.map((g) => (
                  <tr key={g.key} className="border-t border-rule">
                    <td className="py-1.5"><span className="mr-2 inline-block h-3 w-3 rounded-full align-middle" style={{ background: groupColour(g.colourIndex) }} aria-hidden="true" />{g.label}</td>
                    <td className="text-right">{g.runs}</td>
                    <td className="text-right">{g.studs}</td>
                    <td className="text-right">{g.meanPercent === null ? '—' : formatPercent(g.meanPercent)}</td>
                    <td className="text-right">{g.sdPercent === null ? '—' : formatPercent(g.sdPercent)}</td>
                    <td className="text-right">{g.cv === null ? '—' : formatPercent(g.cv * 100)}</td>
                    <td className="text-right">{g.cvInterval ? `${formatPercent(g.cvInterval.lower * 100)} – ${formatPercent(g.cvInterval.upper * 100)}` : '—'}</td>
                    <td className="text-right">{g.meanRunCv === null ? '—' : formatPercent(g.meanRunCv * 100)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="mt-2 text-xs text-muted">CI of CV: Vangel&apos;s modified McKay interval on the pooled final loads. Final loads are pooled across runs as % of each run&apos;s target.</p>
          </section>

          <CompareCharts data={data} />

          <section aria-labelledby="tests-heading" className="rounded-card border border-rule bg-panel p-4">
            <h2 id="tests-heading" className="text-lg font-semibold">Is the difference real?</h2>
            {data.tests.length === 0 ? <p className="mt-2 text-sm text-muted">No test could run on these groups; see the notes above.</p> : null}
            <ul className="mt-2 space-y-3">
              {data.tests.map((t) => (
                <li key={t.name} className="rounded-md border border-rule bg-paper p-3">
                  <div className="text-xs text-muted">{t.question}</div>
                  <p className="font-medium">{t.reading}</p>
                  <p className="num mt-1 text-xs text-muted">{t.name}: statistic {formatNumber(t.statistic, 4)}, df {t.df}, p {formatP(t.pValue)}</p>
                </li>
              ))}
            </ul>
            {data.pairs.length ? (
              <div className="mt-4 overflow-x-auto">
                <h3 className="font-medium">Pairs (Tukey–Kramer, run CV, 95 % family-wise)</h3>
                <table className="mt-1 w-full text-sm">
                  <thead className="text-left text-muted"><tr><th className="py-1">Pair</th><th className="text-right">Difference in mean run CV</th><th className="text-right">95 % interval</th><th className="text-right">Adjusted p</th></tr></thead>
                  <tbody className="num">
                    {data.pairs.map((p) => (
                      <tr key={`${p.a}-${p.b}`} className="border-t border-rule">
                        <td className="py-1.5">{p.a} − {p.b}</td>
                        <td className="text-right">{formatNumber(p.difference * 100, 3)} points</td>
                        <td className="text-right">{formatNumber(p.lower * 100, 3)} to {formatNumber(p.upper * 100, 3)}</td>
                        <td className={`text-right ${p.pValue < 0.05 ? 'font-semibold' : ''}`}>{formatP(p.pValue)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            ) : null}
          </section>

          {data.by === 'lubricant' ? (
            <section aria-labelledby="k-heading" className="rounded-card border border-rule bg-panel p-4">
              <h2 id="k-heading" className="text-lg font-semibold">Nut factor by lubricant</h2>
              {data.nutFactors.length === 0 ? (
                <p className="mt-2 text-sm text-muted">No runs with recorded torque in these groups. Nut factors need runs whose steps carry the applied torque.</p>
              ) : (
                <table className="mt-2 w-full text-sm">
                  <thead className="text-left text-muted"><tr><th className="py-1">Lubricant</th><th className="text-right">Fitted K</th><th className="text-right">95 % CI</th><th className="text-right">Readings</th></tr></thead>
                  <tbody className="num">
                    {data.nutFactors.map((k) => (
                      <tr key={k.key} className="border-t border-rule"><td className="py-1.5">{k.label}</td><td className="text-right">{formatNumber(k.k, 3)}</td><td className="text-right">{formatNumber(k.low, 3)} – {formatNumber(k.high, 3)}</td><td className="text-right">{k.n}</td></tr>
                    ))}
                  </tbody>
                </table>
              )}
              <p className="mt-2 text-xs text-muted">K from T = K·D·F (short form, common practice), fitted through the origin over first-pass steps, where each stud is pulled up from snug so its load right after its own step is the load the torque produced.</p>
            </section>
          ) : null}
        </>
      ) : null}
    </div>
  );
}
