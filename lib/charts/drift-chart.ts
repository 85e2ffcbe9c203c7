import * as Plot from '@observablehq/plot';
import type { RunAnalysis } from '@/lib/analysis/types';
import type { UnitSystem } from '@/lib/calc/units';
import type { ChartSpec } from './chart-spec';
import { chartForceText, percentText } from './chart-format';
import { deviationColour, THEME } from './palette';
import { basePlotOptions } from './plot-theme';

export type DriftInput = Pick<RunAnalysis, 'drift' | 'bandPercent'>;

export interface DriftOptions {
  units: UnitSystem;
}

/**
 * Drift per stud: the change of each stud's load after it was last tightened, in %, as bars below
 * (lost load) or above zero, coloured with the deviation hues (loss = the below hue; saturating at
 * ± 2 × band like the final-load scale).
 */
export function driftChart(run: DriftInput, { units }: DriftOptions): ChartSpec {
  const rows = run.drift.map((d) => ({
    ...d,
    colour: deviationColour(d.driftPercent, run.bandPercent),
    title: `Stud ${d.position}: ${percentText(d.driftPercent, { signed: true })} (${chartForceText(d.afterLastTighteningN, units)} after its last tightening → ${chartForceText(d.finalN, units)} final)`,
  }));
  const finite = rows.filter((r) => Number.isFinite(r.driftPercent));
  const lost = finite.filter((r) => r.driftPercent < 0);
  const worst = finite.length ? finite.reduce((a, b) => (b.driftPercent < a.driftPercent ? b : a)) : undefined;
  const mean = finite.length ? finite.reduce((s, r) => s + r.driftPercent, 0) / finite.length : Number.NaN;
  const description =
    finite.length === 0
      ? 'No drift could be worked out: the run has no stud tightened before the end.'
      : `Drift of ${rows.length} studs after their last tightening: ${lost.length} lost load, mean ${percentText(mean, { signed: true })}; ` +
        `largest loss ${percentText(worst!.driftPercent, { signed: true })} at position ${worst!.position}.`;

  return {
    title: 'Drift after the last tightening',
    description,
    options: basePlotOptions({
      x: { label: 'Stud position', domain: rows.map((r) => r.position), padding: 0.25, labelArrow: 'none', labelAnchor: 'center' },
      y: { label: 'Drift (% of load after last tightening)', grid: true, labelArrow: 'none', nice: true },
      marks: [
        Plot.barY(finite, {
          x: 'position',
          y: 'driftPercent',
          fill: 'colour',
          stroke: THEME.ink,
          strokeWidth: 0.75,
          title: 'title',
          ariaDescription: 'drift',
        }),
        Plot.ruleY([0], { stroke: THEME.ink, strokeWidth: 1.25, ariaDescription: 'zero' }),
      ],
    }),
    legend: {
      kind: 'deviation',
      bandPercent: run.bandPercent,
      labels: { below: 'lost load', on: 'no change', above: 'gained load' },
    },
    table: {
      columns: ['Position', 'After last tightening', 'Final load', 'Drift'],
      rows: rows.map((r) => [
        r.position,
        chartForceText(r.afterLastTighteningN, units),
        chartForceText(r.finalN, units),
        percentText(r.driftPercent, { signed: true }),
      ]),
    },
  };
}
