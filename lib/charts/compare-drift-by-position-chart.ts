import * as Plot from '@observablehq/plot';
import type { ComparisonGroupData } from '@/lib/analysis/types';
import type { ChartSpec } from './chart-spec';
import { percentText } from './chart-format';
import { groupColour, THEME } from './palette';
import { basePlotOptions } from './plot-theme';
import { groupSwatches } from './group-distribution';

interface DriftPoint {
  key: string;
  label: string;
  position: number;
  drift: number;
  colour: string;
}

/** Mean drift (%) by stud position, one line (with dots) per group in the group's colour. */
export function compareDriftByPositionChart(groups: readonly ComparisonGroupData[]): ChartSpec {
  const points: DriftPoint[] = groups.flatMap((g) =>
    g.meanDriftByPosition.map((drift, i) => ({ key: g.key, label: g.label, position: i + 1, drift, colour: groupColour(g.colourIndex) })),
  );
  const finite = points.filter((p) => Number.isFinite(p.drift));
  const maxPosition = Math.max(0, ...groups.map((g) => g.meanDriftByPosition.length));
  const mean = (xs: number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : Number.NaN);
  const description =
    finite.length === 0
      ? 'No drift in any group yet: add complete runs to the groups.'
      : `Mean drift by stud position in ${groups.length} groups. ` +
        groups
          .map((g) => `${g.label}: ${percentText(mean(g.meanDriftByPosition.filter(Number.isFinite)), { signed: true })} on average over ${g.meanDriftByPosition.length} positions`)
          .join('; ') +
        '.';
  const positions = Array.from({ length: maxPosition }, (_, i) => i + 1);
  return {
    title: 'Drift by stud position',
    description,
    options: basePlotOptions({
      x: { label: 'Stud position', domain: [0.5, maxPosition + 0.5], ticks: positions, tickFormat: 'd', labelArrow: 'none', labelAnchor: 'center' },
      y: { label: 'Mean drift (% of load after last tightening)', grid: true, nice: true, labelArrow: 'none' },
      marks: [
        Plot.ruleY([0], { stroke: THEME.ink, strokeWidth: 1.25, ariaDescription: 'zero' }),
        Plot.lineY(finite, { x: 'position', y: 'drift', z: 'key', stroke: 'colour', strokeWidth: 2, ariaDescription: 'group lines' }),
        Plot.dot(finite, {
          x: 'position',
          y: 'drift',
          r: 3.5,
          fill: 'colour',
          title: (p: DriftPoint) => `${p.label}, stud ${p.position}: ${percentText(p.drift, { signed: true })}`,
          ariaDescription: 'group points',
        }),
      ],
    }),
    legend: { kind: 'swatches', items: groupSwatches(groups, 'line') },
    table: {
      columns: ['Position', ...groups.map((g) => `${g.label} (%)`)],
      rows: positions.map((position) => [
        position,
        ...groups.map((g) => {
          const v = g.meanDriftByPosition[position - 1];
          return v === undefined || !Number.isFinite(v) ? '—' : percentText(v, { signed: true });
        }),
      ]),
    },
  };
}
