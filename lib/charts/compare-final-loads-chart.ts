import * as Plot from '@observablehq/plot';
import type { ComparisonGroupData } from '@/lib/analysis/types';
import type { ChartSpec } from './chart-spec';
import { percentText } from './chart-format';
import { columnScale, distributionMarks, distributionTable, fitGroupColumns, groupSwatches } from './group-distribution';
import { textWidth } from './label-layout';
import { THEME } from './palette';
import { basePlotOptions } from './plot-theme';

export interface CompareFinalLoadsOptions {
  /** The band (± %) drawn as lines at 100 − band and 100 + band. */
  bandPercent: number;
}

/**
 * Final loads of every run of each group as % of target: one column per group with jittered dots
 * (deterministic) and a Tukey box (R-7 quartiles, whiskers at 1.5 IQR); lines at 100 % and
 * 100 ± band.
 */
export function compareFinalLoadsChart(
  groups: readonly ComparisonGroupData[],
  { bandPercent }: CompareFinalLoadsOptions,
): ChartSpec {
  const dist = groups.map((g) => ({ key: g.key, label: g.label, colourIndex: g.colourIndex, values: g.finalLoadsPercent, box: g.finalLoadsBox }));
  const { marks, boxes } = distributionMarks(dist);
  const bandLines = [
    { y: 100 - bandPercent, label: percentText(100 - bandPercent) },
    { y: 100 + bandPercent, label: percentText(100 + bandPercent) },
  ];
  const description =
    boxes.length === 0
      ? 'No final loads in any group yet: add runs to the groups to compare them.'
      : `Final loads as % of target in ${groups.length} groups, band 100 ± ${percentText(bandPercent)}. ` +
        boxes
          .map((b) => {
            const inBand = groups.find((g) => g.key === b.key)!.finalLoadsPercent.filter((v) => Math.abs(v - 100) <= bandPercent).length;
            return `${b.label}: median ${percentText(b.median)}, middle half ${percentText(b.q1)} to ${percentText(b.q3)}, ${inBand} of ${b.n} loads within the band`;
          })
          .join('; ') +
        '.';
  return {
    title: 'Final loads by group (% of target)',
    description,
    fit: fitGroupColumns(dist),
    options: basePlotOptions({
      height: 380,
      // The band labels sit in the right margin, beside their lines and clear of the dots.
      marginRight: Math.ceil(12 + Math.max(...bandLines.map((b) => textWidth(b.label, 13)))),
      x: columnScale(dist),
      y: { label: 'Final load (% of target)', grid: true, nice: true, labelArrow: 'none' },
      marks: [
        Plot.ruleY([100], { stroke: THEME.ink, strokeWidth: 1.25, ariaDescription: 'target' }),
        Plot.ruleY(bandLines, { y: 'y', stroke: THEME.muted, strokeDasharray: '4 3', ariaDescription: 'band lines' }),
        Plot.text(bandLines, { y: 'y', text: 'label', frameAnchor: 'right', textAnchor: 'start', dx: 6, fill: THEME.muted, ariaDescription: 'band labels' }),
        ...marks,
      ],
    }),
    legend: {
      kind: 'swatches',
      items: [
        ...groupSwatches(groups, 'dot'),
        { label: `Band 100 ± ${percentText(bandPercent)}`, colour: THEME.muted, shape: 'dashed-line' as const },
      ],
    },
    table: distributionTable(dist, boxes),
  };
}
