import type { PlotOptions } from '@observablehq/plot';
import * as Plot from '@observablehq/plot';
import { GROUP_COLOURS } from './palette';
import { formatPercentFixed } from '@/lib/calc/units';
import { dodge, textWidth } from './label-layout';

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

const HEIGHT = 320;
const MARGIN = { top: 20, bottom: 30 };

/**
 * Plot options: CV and largest deviation (both %) over attempts, with the criteria limits as
 * dashed rules named in the right margin (dodged apart when the two limits are close), clear of
 * the dots. Without `width` the chart takes the width it is drawn in.
 */
export function progressChartOptions(points: readonly ProgressPoint[], limits: { cvPercent: number | null; bandPercent: number | null }, width?: number): PlotOptions {
  const data = progressData(points);
  const rules = [
    ...(limits.cvPercent !== null ? [{ y: limits.cvPercent, label: `CV limit ${limits.cvPercent} %` }] : []),
    ...(limits.bandPercent !== null ? [{ y: limits.bandPercent, label: `Band ±${limits.bandPercent} %` }] : []),
  ];
  const yMax = Math.max(1, ...data.map((d) => d.percent), ...rules.map((r) => r.y)) * 1.08;
  const yPx = (y: number) => HEIGHT - MARGIN.bottom - (y / yMax) * (HEIGHT - MARGIN.top - MARGIN.bottom);
  const placed = dodge(rules.map((r) => yPx(r.y)), 15, MARGIN.top, HEIGHT - MARGIN.bottom);
  const labels = rules.map((r, i) => ({ ...r, labelY: (yMax * (HEIGHT - MARGIN.bottom - placed[i]!)) / (HEIGHT - MARGIN.top - MARGIN.bottom) }));
  return {
    ...(width ? { width } : {}),
    height: HEIGHT,
    marginTop: MARGIN.top,
    marginBottom: MARGIN.bottom,
    marginLeft: 56,
    marginRight: Math.ceil(14 + Math.max(0, ...rules.map((r) => textWidth(r.label, 13)))),
    x: { label: 'Attempt (number)', tickFormat: 'd', ticks: Math.min(points.length, 12), domain: [0.5, Math.max(1, points.length) + 0.5] },
    y: { label: 'Percent (%)', grid: true, domain: [0, yMax] },
    color: { domain: ['CV of final loads', 'Largest deviation from target'], range: [GROUP_COLOURS[0], GROUP_COLOURS[1]], legend: true },
    marks: [
      Plot.ruleY(rules, { y: 'y', stroke: 'var(--el-muted)', strokeDasharray: '4 3' }),
      Plot.text(labels, { y: 'labelY', text: 'label', frameAnchor: 'right', textAnchor: 'start', dx: 6, fill: 'var(--el-muted)' }),
      Plot.line(data, { x: 'attempt', y: 'percent', stroke: 'measure', z: 'measure', strokeWidth: 2 }),
      Plot.dot(data, { x: 'attempt', y: 'percent', fill: 'measure', r: 4, tip: true, title: (d: ProgressDatum) => `Attempt ${d.attempt}: ${d.measure} ${formatPercentFixed(d.percent, { decimals: 2 })}` }),
    ],
  };
}
