import * as Plot from '@observablehq/plot';
import type { ChartSpec } from './chart-spec';
import { numberText } from './chart-format';
import { groupColour, THEME } from './palette';
import { basePlotOptions } from './plot-theme';
import { textWidth, wrapWords } from './label-layout';

/** A fitted nut factor for one lubricant, with its confidence interval. */
export interface NutFactorRow {
  label: string;
  k: number;
  low: number;
  high: number;
  /** Runs (or steps) the fit used. */
  n: number;
  colourIndex: number;
}

/** Fitted nut factor K per lubricant with its confidence interval as error bars (K has no unit). */
export function nutFactorChart(rows: readonly NutFactorRow[], options: { confidencePercent?: number } = {}): ChartSpec {
  const level = options.confidencePercent ?? 95;
  const data = rows.map((r) => ({ ...r, colour: groupColour(r.colourIndex) }));
  const description =
    rows.length === 0
      ? 'No nut factor fitted yet: compare runs with recorded torque by lubricant.'
      : `Fitted nut factor K for ${rows.length} lubricants (${level} % intervals): ` +
        rows.map((r) => `${r.label} ${numberText(r.k)} (${numberText(r.low)} to ${numberText(r.high)}, n = ${r.n})`).join('; ') +
        '. A lower K gives more preload for the same torque.';
  const counts = rows.map((r) => `n = ${r.n}`);
  return {
    title: 'Nut factor K by lubricant',
    // Whole lubricant names: wrapped onto lines no wider than about a third of the chart, with the
    // left margin as wide as the longest line.
    fit: (opts, { width, fontPx }) => {
      const room = Math.max(80, Math.min(240, width * 0.34));
      const wrapped = rows.map((r) => wrapWords(r.label, room, fontPx));
      const widest = Math.max(0, ...wrapped.flat().map((line) => textWidth(line, fontPx)));
      const lines = Math.max(1, ...wrapped.map((w) => w.length));
      const byLabel = new Map(rows.map((r, i) => [r.label, wrapped[i]!.join('\n')]));
      return {
        ...opts,
        height: Math.max(160, 60 + rows.length * Math.max(48, (lines + 1.5) * fontPx)),
        marginLeft: Math.ceil(widest + 16),
        marginRight: Math.ceil(16 + Math.max(0, ...counts.map((c) => textWidth(c, fontPx)))),
        y: { ...(opts.y ?? {}), tickFormat: (label: string) => byLabel.get(label) ?? label },
      };
    },
    description,
    options: basePlotOptions({
      height: Math.max(160, 60 + rows.length * 48),
      marginLeft: 140,
      marginRight: 64,
      x: { label: `Nut factor K (no unit), ${level} % interval`, grid: true, nice: true, labelArrow: 'none', labelAnchor: 'center' },
      y: { label: null, domain: rows.map((r) => r.label), padding: 0.4 },
      marks: [
        Plot.ruleY(data, { y: 'label', x1: 'low', x2: 'high', stroke: 'colour', strokeWidth: 2.5, ariaDescription: 'intervals' }),
        Plot.tickX(data, { y: 'label', x: 'low', stroke: 'colour', strokeWidth: 2, ariaDescription: 'interval low caps' }),
        Plot.tickX(data, { y: 'label', x: 'high', stroke: 'colour', strokeWidth: 2, ariaDescription: 'interval high caps' }),
        Plot.dot(data, {
          y: 'label',
          x: 'k',
          r: 6,
          fill: 'colour',
          stroke: THEME.ink,
          strokeWidth: 1,
          title: (r: NutFactorRow) => `${r.label}: K = ${numberText(r.k)} (${numberText(r.low)} to ${numberText(r.high)}, n = ${r.n})`,
          ariaDescription: 'fitted K',
        }),
        Plot.text(data, { y: 'label', x: 'high', text: (r: NutFactorRow) => `n = ${r.n}`, dx: 8, textAnchor: 'start', fill: THEME.muted, ariaDescription: 'counts' }),
      ],
    }),
    legend: { kind: 'swatches', items: rows.map((r) => ({ label: r.label, colour: groupColour(r.colourIndex), shape: 'dot' as const })) },
    table: {
      columns: ['Lubricant', 'K', `${level} % low`, `${level} % high`, 'n'],
      rows: rows.map((r) => [r.label, numberText(r.k), numberText(r.low), numberText(r.high), r.n]),
    },
  };
}
