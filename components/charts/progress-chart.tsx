'use client';

import { useMemo } from 'react';
import { progressChartOptions, type ProgressPoint } from '@/lib/charts/progress-chart';
import { PlotFigure } from './plot-figure';

export function ProgressChart({ points, cvLimit, bandLimit }: { points: ProgressPoint[]; cvLimit: number | null; bandLimit: number | null }) {
  const options = useMemo(() => progressChartOptions(points, { cvPercent: cvLimit, bandPercent: bandLimit }), [points, cvLimit, bandLimit]);
  return <PlotFigure options={options} label="Chart of the CV of final loads and the largest deviation from target, in percent, over your attempts. The table below gives the same figures." />;
}
