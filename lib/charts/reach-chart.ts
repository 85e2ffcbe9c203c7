import * as Plot from '@observablehq/plot';
import type { ReachEstimate } from '@/lib/analysis/types';
import type { ChartSpec } from './chart-spec';
import { numberText } from './chart-format';
import { THEME } from './palette';
import { basePlotOptions } from './plot-theme';

/** Two-sided 95 % normal multiplier (z at 0.975 = 1.959964…, NIST/SEMATECH e-Handbook §1.3.6.7.1). */
export const Z_95 = 1.96;

/** Half-width of the error-bar caps, in distance units. */
const CAP = 0.08;

export interface ReachRow extends ReachEstimate {
  low: number;
  high: number;
}

export function reachRows(reach: readonly ReachEstimate[]): ReachRow[] {
  return reach.map((r) => ({ ...r, low: r.coefficient - Z_95 * r.standardError, high: r.coefficient + Z_95 * r.standardError }));
}

/**
 * Reach: the interaction coefficient by neighbour distance k (change of a stud's load per unit load
 * added to a stud k positions away; negative = it relaxes), with ± 1.96 standard errors as error
 * bars and a zero rule. The coefficient is a ratio of forces (N per N), so it has no unit.
 */
export function reachChart(reach: readonly ReachEstimate[]): ChartSpec {
  const rows = reachRows(reach);
  const strongest = rows.length ? rows.reduce((a, b) => (Math.abs(b.coefficient) > Math.abs(a.coefficient) ? b : a)) : undefined;
  const description = !strongest
    ? 'No reach could be estimated for this run.'
    : `Reach at ${rows.length} distances. Strongest at distance ${strongest.distance}: ${numberText(strongest.coefficient, 2)} per unit load added ` +
      `(95 % interval ${numberText(strongest.low, 2)} to ${numberText(strongest.high, 2)}); ` +
      'a value of −0.1 means a stud loses 0.1 kN for every kN added to the stud at that distance. ' +
      `Intervals crossing zero: ${rows.filter((r) => r.low <= 0 && r.high >= 0).map((r) => r.distance).join(', ') || 'none'}.`;
  return {
    title: 'Reach: how far tightening one stud moves the others',
    description,
    options: basePlotOptions({
      marginLeft: 72,
      x: {
        label: 'Distance k (positions apart)',
        domain: [0.5, Math.max(1, ...rows.map((r) => r.distance)) + 0.5],
        ticks: rows.map((r) => r.distance),
        tickFormat: 'd',
        labelArrow: 'none',
        labelAnchor: 'center',
      },
      y: { label: 'Change per unit load added at distance k (N/N)', grid: true, nice: true, labelArrow: 'none' },
      marks: [
        Plot.ruleY([0], { stroke: THEME.ink, strokeWidth: 1.25, ariaDescription: 'zero' }),
        Plot.ruleX(rows, { x: 'distance', y1: 'low', y2: 'high', stroke: THEME.ink, strokeWidth: 1.5, ariaDescription: 'error bars' }),
        Plot.ruleY(rows, { x1: (r: ReachRow) => r.distance - CAP, x2: (r: ReachRow) => r.distance + CAP, y: 'low', stroke: THEME.ink, strokeWidth: 1.5, ariaDescription: 'error bar low caps' }),
        Plot.ruleY(rows, { x1: (r: ReachRow) => r.distance - CAP, x2: (r: ReachRow) => r.distance + CAP, y: 'high', stroke: THEME.ink, strokeWidth: 1.5, ariaDescription: 'error bar high caps' }),
        Plot.dot(rows, {
          x: 'distance',
          y: 'coefficient',
          r: 5,
          fill: THEME.ink,
          title: (r: ReachRow) =>
            `Distance ${r.distance}: ${numberText(r.coefficient, 3)} (95 % interval ${numberText(r.low, 3)} to ${numberText(r.high, 3)}, ${r.observations} observations)`,
          ariaDescription: 'coefficients',
        }),
      ],
    }),
    legend: {
      kind: 'swatches',
      items: [
        { label: 'Estimate', colour: THEME.ink, shape: 'dot' },
        { label: '± 1.96 standard errors (about 95 %)', colour: THEME.ink, shape: 'line' },
      ],
    },
    table: {
      columns: ['Distance k', 'Coefficient (N/N)', 'Standard error', '95 % low', '95 % high', 'Observations'],
      rows: rows.map((r) => [r.distance, numberText(r.coefficient), numberText(r.standardError), numberText(r.low), numberText(r.high), r.observations]),
    },
  };
}
