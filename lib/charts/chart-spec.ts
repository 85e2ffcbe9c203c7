import type { PlotOptions } from '@observablehq/plot';

/** The numbers behind a chart, shown under "Show the numbers" (units in the cells or headers). */
export interface ChartTable {
  columns: string[];
  rows: (string | number)[][];
}

/** One entry of a legend drawn by us (beside the plot, in HTML, so it reads in both themes). */
export interface LegendSwatch {
  label: string;
  colour: string;
  /** How the colour appears in the chart. */
  shape: 'dot' | 'line' | 'dashed-line' | 'bar' | 'band';
}

export type ChartLegend =
  | { kind: 'deviation'; bandPercent: number; labels?: { below: string; on: string; above: string } }
  | { kind: 'swatches'; items: LegendSwatch[] };

/**
 * What every chart builder returns: Plot options (plain data and mark objects, no DOM), a visible
 * title, a one-paragraph text alternative, the table of the numbers, and the legend where colour
 * carries meaning.
 */
export interface ChartSpec {
  options: PlotOptions;
  title: string;
  description: string;
  table: ChartTable;
  legend?: ChartLegend;
}
