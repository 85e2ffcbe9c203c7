import type { PlotOptions } from '@observablehq/plot';
import * as Plot from '@observablehq/plot';
import { GROUP_COLOURS } from './palette';
import { formatPercentFixed } from '@/lib/calc/units';

export interface ProgressPoint {
  attempt: number;
  cvPercent: number | null;
  largestDeviationPercent: number | null;
}

export interface ProgressDatum {
  attempt: number;
  measure: 'CV of final loads' | 'Largest deviation from target';
  percent: number;
}

/** The long-form data of the progress chart: one row per attempt and measure, missing values left out. */
export function progressData(points: readonly ProgressPoint[]): ProgressDatum[] {
  return points.flatMap((p) => [
    ...(p.cvPercent === null ? [] : [{ attempt: p.attempt, measure: 'CV of final loads' as const, percent: p.cvPercent }]),
    ...(p.largestDeviationPercent === null ? [] : [{ attempt: p.attempt, measure: 'Largest deviation from target' as const, percent: p.largestDeviationPercent }]),
  ]);
}

/** Plot options: CV and largest deviation (both %) over attempts, with the criteria limits as rules. */
export function progressChartOptions(points: readonly ProgressPoint[], limits: { cvPercent: number | null; bandPercent: number | null }, width = 880): PlotOptions {
  const data = progressData(points);
  const rules = [
    ...(limits.cvPercent !== null ? [{ y: limits.cvPercent, label: `CV limit ${limits.cvPercent} %` }] : []),
    ...(limits.bandPercent !== null ? [{ y: limits.bandPercent, label: `Band ±${limits.bandPercent} %` }] : []),
  ];
  return {
    width,
    height: 320,
    marginLeft: 56,
    x: { label: 'Attempt (number)', tickFormat: 'd', ticks: Math.min(points.length, 12), domain: [0.5, Math.max(1, points.length) + 0.5] },
    y: { label: 'Percent (%)', grid: true, zero: true },
    color: { domain: ['CV of final loads', 'Largest deviation from target'], range: [GROUP_COLOURS[0], GROUP_COLOURS[3]], legend: true },
    marks: [
      Plot.ruleY(rules, { y: 'y', stroke: 'var(--el-muted)', strokeDasharray: '4 3' }),
      Plot.text(rules, { y: 'y', text: 'label', frameAnchor: 'right', textAnchor: 'end', dy: -7, fill: 'var(--el-muted)' }),
      Plot.line(data, { x: 'attempt', y: 'percent', stroke: 'measure', z: 'measure', strokeWidth: 2 }),
      Plot.dot(data, { x: 'attempt', y: 'percent', fill: 'measure', r: 4, tip: true, title: (d: ProgressDatum) => `Attempt ${d.attempt}: ${d.measure} ${formatPercentFixed(d.percent, { decimals: 2 })}` }),
    ],
  };
}
