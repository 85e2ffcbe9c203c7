import type { ComparisonGroupData } from '@/lib/analysis/types';
import type { ChartSpec } from './chart-spec';
import { percentText } from './chart-format';
import { columnScale, distributionMarks, distributionTable, fitGroupColumns, groupSwatches } from './group-distribution';
import { basePlotOptions } from './plot-theme';

/**
 * The CV of each run's final loads, one column per group, as jittered dots and a Tukey box
 * (R-7 quartiles, whiskers at 1.5 IQR). CV in % (the input is a fraction).
 */
export function compareRunCvChart(groups: readonly ComparisonGroupData[]): ChartSpec {
  const dist = groups.map((g) => ({ key: g.key, label: g.label, colourIndex: g.colourIndex, values: g.runCvs.map((cv) => cv * 100), box: g.runCvBox }));
  const { marks, boxes } = distributionMarks(dist);
  const description =
    boxes.length === 0
      ? 'No runs in any group yet: add runs to the groups to compare their scatter.'
      : `CV of the final loads of each run, in ${groups.length} groups (lower is more even). ` +
        boxes.map((b) => `${b.label}: median ${percentText(b.median)} over ${b.n} runs, middle half ${percentText(b.q1)} to ${percentText(b.q3)}`).join('; ') +
        '.';
  return {
    title: 'Scatter of runs by group (CV)',
    description,
    fit: fitGroupColumns(dist),
    options: basePlotOptions({
      height: 360,
      x: columnScale(dist),
      y: { label: 'Run CV (%)', grid: true, nice: true, zero: true, labelArrow: 'none' },
      marks,
    }),
    legend: { kind: 'swatches', items: groupSwatches(groups, 'dot') },
    table: distributionTable(dist, boxes),
  };
}
