'use client';

import { useMemo } from 'react';
import { progressChartOptions, type ProgressPoint } from '@/lib/charts/progress-chart';
import { PlotFigure } from './plot-figure';

export function ProgressChart({ points, cvLimit, bandLimit }: { points: ProgressPoint[]; cvLimit: number | null; bandLimit: number | null }) {
  const options = useMemo(() => progressChartOptions(points, { cvPercent: cvLimit, bandPercent: bandLimit }), [points, cvLimit, bandLimit]);
  return (
    <PlotFigure
      options={options}
      title="Your evenness over attempts"
      description="The CV of your final loads and your largest deviation from target, in percent, attempt by attempt. Lower is more even. The table below gives the same figures."
    />
  );
}
