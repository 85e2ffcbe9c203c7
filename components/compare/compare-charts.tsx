'use client';

import { useMemo } from 'react';
import { PlotFigure } from '@/components/charts/plot-figure';
import { compareDriftByPositionChart, compareFinalLoadsChart, compareRunCvChart, nutFactorChart } from '@/lib/charts';
import type { CompareResponse } from '@/lib/data/compare';

/** The comparison's pictures; a group keeps its colour slot across all of them. */
export function CompareCharts({ data, bandPercent = 10 }: { data: CompareResponse; bandPercent?: number }) {
  const finalSpec = useMemo(() => compareFinalLoadsChart(data.chartGroups, { bandPercent }), [data, bandPercent]);
  const cvSpec = useMemo(() => compareRunCvChart(data.chartGroups), [data]);
  const driftSpec = useMemo(() => compareDriftByPositionChart(data.chartGroups), [data]);
  const kSpec = useMemo(() => (data.nutFactors.length ? nutFactorChart(data.nutFactors) : null), [data]);
  if (data.chartGroups.length === 0) {
    return <p className="rounded-card border border-dashed border-rule p-6 text-center text-sm text-muted">No complete runs match. Widen the dates, choose other groups, or record runs first.</p>;
  }
  return (
    <div className="space-y-4">
      <div className="grid gap-4 xl:grid-cols-2">
        <PlotFigure {...finalSpec} className="rounded-card border border-rule bg-panel p-4" />
        <PlotFigure {...cvSpec} className="rounded-card border border-rule bg-panel p-4" />
      </div>
      <PlotFigure {...driftSpec} className="rounded-card border border-rule bg-panel p-4" />
      {kSpec ? <PlotFigure {...kSpec} className="rounded-card border border-rule bg-panel p-4" /> : null}
    </div>
  );
}
