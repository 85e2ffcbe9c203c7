'use client';

import { useMemo } from 'react';
import { PlotFigure } from '@/components/charts/plot-figure';
import { compareDriftByPositionChart, compareFinalLoadsChart, compareRunCvChart, nutFactorChart } from '@/lib/charts';
import type { CompareResponse } from '@/lib/data/compare';

/** The comparison's pictures; a group keeps its colour slot across all of them. Drift by position only within one stud count. */
export function CompareCharts({ data, bandPercent = 10, onPickStudCount }: { data: CompareResponse; bandPercent?: number; onPickStudCount?: (studCount: number) => void }) {
  const oneStudCount = data.studCounts.length === 1;
  const finalSpec = useMemo(() => compareFinalLoadsChart(data.chartGroups, { bandPercent }), [data, bandPercent]);
  const cvSpec = useMemo(() => compareRunCvChart(data.chartGroups), [data]);
  const driftSpec = useMemo(() => (oneStudCount ? compareDriftByPositionChart(data.chartGroups) : null), [data, oneStudCount]);
  const kSpec = useMemo(() => (data.nutFactors.length ? nutFactorChart(data.nutFactors) : null), [data]);
  if (data.chartGroups.length === 0) {
    return <p className="rounded-card border border-dashed border-rule p-6 text-center text-sm text-muted">No runs match. Widen the dates, choose other groups or sources, or record runs first.</p>;
  }
  return (
    <div className="space-y-4">
      <div className="grid gap-4 xl:grid-cols-2">
        <PlotFigure {...finalSpec} className="rounded-card border border-rule bg-panel p-4" />
        <PlotFigure {...cvSpec} className="rounded-card border border-rule bg-panel p-4" />
      </div>
      {driftSpec ? (
        <PlotFigure {...driftSpec} className="rounded-card border border-rule bg-panel p-4" />
      ) : (
        <div className="rounded-card border border-dashed border-rule p-4 text-sm">
          <p>Drift by stud position compares positions of joints with the same number of studs. These runs have {data.studCounts.join(', ')} studs: pick one to see it.</p>
          <div className="mt-2 flex flex-wrap gap-2">
            {data.studCounts.map((n) => (
              <button key={n} type="button" onClick={() => onPickStudCount?.(n)} className="rounded-full border border-rule px-3 py-1">{n} studs</button>
            ))}
          </div>
        </div>
      )}
      {kSpec ? <PlotFigure {...kSpec} className="rounded-card border border-rule bg-panel p-4" /> : null}
    </div>
  );
}
