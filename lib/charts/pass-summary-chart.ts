import * as Plot from '@observablehq/plot';
import type { PassSummary } from '@/lib/analysis/types';
import type { ChartSpec } from './chart-spec';
import { passLabel, percentText } from './chart-format';
import { THEME } from './palette';
import { basePlotOptions } from './plot-theme';
import { fitColumnLabels } from './label-layout';

interface PassRow {
  pass: number;
  label: string;
  cvPercent: number;
  meanLossPercent: number;
}

/**
 * Pass by pass: the CV of all studs' loads at the end of each pass (line and dots) and the mean
 * change of the studs tightened in that pass from right after tightening to the end of the pass
 * (bars; negative = load lost to later tightening). Both in %: CV in % of the mean load, the change
 * in % of the load after tightening.
 */
export function passSummaryChart(passes: readonly PassSummary[]): ChartSpec {
  const rows: PassRow[] = passes.map((p) => ({
    pass: p.pass,
    label: passLabel(p.pass, p.percentOfTarget),
    cvPercent: p.cv * 100,
    meanLossPercent: p.meanLossPercent,
  }));
  const last = rows[rows.length - 1];
  const first = rows[0];
  const description =
    !first || !last
      ? 'No passes were recorded for this run.'
      : `CV after each of ${rows.length} passes: ${rows.map((r) => `${r.label} ${percentText(r.cvPercent)}`).join('; ')}. ` +
        `Mean change of the studs tightened in each pass by its end: ${rows.map((r) => percentText(r.meanLossPercent, { signed: true })).join(', ')}.`;
  const label = (pass: number) => rows.find((r) => r.pass === pass)?.label ?? `Pass ${pass}`;
  const names = rows.map((r) => r.label);
  return {
    title: 'Scatter and load loss pass by pass',
    // Pass names wrap under their columns, or shrink to the pass number when the columns are narrow.
    fit: (opts, { width, fontPx }) => {
      const plotWidth = width - (opts.marginLeft ?? 0) - (opts.marginRight ?? 0);
      const fitted = fitColumnLabels(names, plotWidth / Math.max(1, rows.length), fontPx, { maxLines: 2, keys: rows.map((r) => String(r.pass)) });
      return {
        ...opts,
        marginBottom: Math.ceil(20 + fitted.lineCount * fontPx + (fitted.mode === 'keyed' ? fontPx + 4 : 0)),
        x: { ...(opts.x ?? {}), tickFormat: (pass: number) => fitted.ticks[rows.findIndex((r) => r.pass === pass)] ?? '', label: fitted.mode === 'keyed' ? 'Pass' : null, labelAnchor: 'center', labelArrow: 'none' },
      };
    },
    description,
    options: basePlotOptions({
      x: {
        label: null,
        domain: rows.length ? [rows[0]!.pass - 0.5, rows[rows.length - 1]!.pass + 0.5] : [0.5, 1.5],
        ticks: rows.map((r) => r.pass),
        tickFormat: label,
      },
      y: { label: 'Percent (%)', grid: true, nice: true, labelArrow: 'none', insetTop: 26 },
      marks: [
        Plot.rectY(rows, {
          x1: (r: PassRow) => r.pass - 0.22,
          x2: (r: PassRow) => r.pass + 0.22,
          y1: 0,
          y2: 'meanLossPercent',
          fill: THEME.below,
          fillOpacity: 0.7,
          title: (r: PassRow) => `${r.label}: mean change ${percentText(r.meanLossPercent, { signed: true })}`,
          ariaDescription: 'mean change',
        }),
        Plot.ruleY([0], { stroke: THEME.ink, strokeWidth: 1.25, ariaDescription: 'zero' }),
        Plot.lineY(rows, { x: 'pass', y: 'cvPercent', stroke: THEME.ink, strokeWidth: 2, ariaDescription: 'CV line' }),
        Plot.dot(rows, {
          x: 'pass',
          y: 'cvPercent',
          r: 5,
          fill: THEME.ink,
          title: (r: PassRow) => `${r.label}: CV ${percentText(r.cvPercent)}`,
          ariaDescription: 'CV',
        }),
        Plot.text(rows, {
          x: 'pass',
          y: 'cvPercent',
          text: (r: PassRow) => percentText(r.cvPercent),
          dy: -15,
          fill: THEME.ink,
          ariaDescription: 'CV labels',
        }),
      ],
    }),
    legend: {
      kind: 'swatches',
      items: [
        { label: 'CV of all loads at the end of the pass', colour: THEME.ink, shape: 'line' },
        { label: 'Mean change of the studs tightened in the pass', colour: THEME.below, shape: 'bar' },
      ],
    },
    table: {
      columns: ['Pass', 'CV at end of pass', 'Mean change of studs tightened'],
      rows: rows.map((r) => [r.label, percentText(r.cvPercent), percentText(r.meanLossPercent, { signed: true })]),
    },
  };
}
