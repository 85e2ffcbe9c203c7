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

/** The frame a chart is drawn in: its width in px and the base font size in px. */
export interface ChartFrame {
  width: number;
  fontPx: number;
}

export type ChartFit = (options: PlotOptions, frame: ChartFrame) => PlotOptions;

/**
 * What every chart builder returns: Plot options (plain data and mark objects, no DOM), a visible
 * title, a one-paragraph text alternative, the table of the numbers, and the legend where colour
 * carries meaning.
 */
export interface ChartSpec {
  options: PlotOptions;
  /**
   * Lays the labels out for the width the chart gets on screen (wrapped or keyed group names,
   * dodged line-end numbers, pass names that fit): takes the options as they will be drawn
   * (a caller may have changed height or domains) and returns them with the labels placed.
   */
  fit?: ChartFit;
  title: string;
  description: string;
  table: ChartTable;
  legend?: ChartLegend;
}
