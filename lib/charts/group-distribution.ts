import * as Plot from '@observablehq/plot';
import type { ChartFit, ChartTable, LegendSwatch } from './chart-spec';
import { fitColumnLabels, groupKey } from './label-layout';
import { boxStats, type BoxStats } from './box-stats';
import { jitter } from './jitter';
import { groupColour, THEME } from './palette';
import { percentText } from './chart-format';

export interface DistributionGroup {
  key: string;
  label: string;
  colourIndex: number;
  /** The dots to draw (may be a sample of the group when it is large). */
  values: readonly number[];
  /** The box of the whole group, when `values` is only a sample of it. */
  box?: BoxStats;
}

export interface DistributionDot {
  key: string;
  label: string;
  column: number;
  x: number;
  value: number;
  colour: string;
}

export interface DistributionBox extends BoxStats {
  key: string;
  label: string;
  column: number;
  colour: string;
}

/** Half-width of the jitter strip and of the box, in columns (column spacing is 1). */
export const JITTER_WIDTH = 0.28;
export const BOX_HALF_WIDTH = 0.16;

/**
 * Dots (deterministically jittered per group key and index) and Tukey boxes for one column per
 * group; x is the column number, labelled with the group label. Values are % (of target, or CV).
 */
export function distributionMarks(groups: readonly DistributionGroup[]) {
  const dots: DistributionDot[] = groups.flatMap((g, column) =>
    g.values
      .filter((v) => Number.isFinite(v))
      .map((value, i) => ({
        key: g.key,
        label: g.label,
        column,
        x: column + jitter(g.key, i, JITTER_WIDTH),
        value,
        colour: groupColour(g.colourIndex),
      })),
  );
  const boxes: DistributionBox[] = groups.flatMap((g, column) => {
    const stats = g.box ?? boxStats(g.values.filter((v) => Number.isFinite(v)));
    return stats ? [{ ...stats, key: g.key, label: g.label, column, colour: groupColour(g.colourIndex) }] : [];
  });
  const left = (b: DistributionBox) => b.column - BOX_HALF_WIDTH;
  const right = (b: DistributionBox) => b.column + BOX_HALF_WIDTH;
  const marks = [
    Plot.dot(dots, {
      x: 'x',
      y: 'value',
      r: 2.5,
      fill: 'colour',
      fillOpacity: 0.55,
      title: (d: DistributionDot) => `${d.label}: ${percentText(d.value)}`,
      ariaDescription: 'values',
    }),
    Plot.ruleX(boxes, { x: 'column', y1: 'lowerWhisker', y2: 'q1', stroke: THEME.ink, strokeWidth: 1.25, ariaDescription: 'lower whiskers' }),
    Plot.ruleX(boxes, { x: 'column', y1: 'q3', y2: 'upperWhisker', stroke: THEME.ink, strokeWidth: 1.25, ariaDescription: 'upper whiskers' }),
    Plot.rect(boxes, {
      x1: left,
      x2: right,
      y1: 'q1',
      y2: 'q3',
      fill: 'colour',
      fillOpacity: 0.18,
      stroke: 'colour',
      strokeWidth: 1.5,
      title: (b: DistributionBox) =>
        `${b.label}: median ${percentText(b.median)}, quartiles ${percentText(b.q1)} to ${percentText(b.q3)}, n = ${b.n}`,
      ariaDescription: 'boxes',
    }),
    Plot.ruleY(boxes, { x1: left, x2: right, y: 'median', stroke: THEME.ink, strokeWidth: 2.5, ariaDescription: 'medians' }),
  ];
  return { dots, boxes, marks };
}

/** A group's name with its key as the axis and the legend show it: "A · Dry". */
export function keyedLabel(label: string, index: number): string {
  return `${groupKey(index)} · ${label}`;
}

/** Legend swatches for the groups, each named with its key. */
export function groupSwatches(groups: readonly { label: string; colourIndex: number }[], shape: LegendSwatch['shape']): LegendSwatch[] {
  return groups.map((g, i) => ({ label: keyedLabel(g.label, i), colour: groupColour(g.colourIndex), shape }));
}

/**
 * The x scale for one column per group. Each tick is the group's key (A, B, …) with its whole name
 * wrapped under it when the names fit the columns (`ticks` from `fitColumnLabels`), else the key
 * alone and the legend spells the names out.
 */
export function columnScale(groups: readonly DistributionGroup[], ticks?: readonly string[]) {
  return {
    label: null,
    domain: [-0.6, Math.max(groups.length - 1, 0) + 0.6],
    ticks: groups.map((_, i) => i),
    tickFormat: (i: number) => ticks?.[i] ?? groupKey(i),
    tickSize: 0,
  };
}

/** Lines of a multi-line tick label are 1 em apart (Plot's text default). */
const LINE_EM = 1;

/** Fits the group names under their columns for the drawn width (wrapped whole names, or keys). */
export function fitGroupColumns(groups: readonly DistributionGroup[]): ChartFit {
  return (options, { width, fontPx }) => {
    const plotWidth = width - (options.marginLeft ?? 0) - (options.marginRight ?? 0);
    const columnWidth = plotWidth / Math.max(1.2, groups.length + 0.2);
    const names = fitColumnLabels(groups.map((g) => g.label), columnWidth, fontPx, { maxLines: 3 });
    const ticks = groups.map((_, i) => (names.mode === 'wrapped' ? `${groupKey(i)}\n${names.ticks[i]}` : names.ticks[i]!));
    const lines = names.mode === 'wrapped' ? names.lineCount + 1 : 1;
    return { ...options, marginBottom: Math.ceil(16 + lines * fontPx * LINE_EM), x: columnScale(groups, ticks) };
  };
}

export function distributionTable(groups: readonly DistributionGroup[], boxes: readonly DistributionBox[]): ChartTable {
  return {
    columns: ['Group', 'n', 'Median', 'Q1', 'Q3', 'Lower whisker', 'Upper whisker', 'Outliers'],
    rows: groups.map((g) => {
      const b = boxes.find((x) => x.key === g.key);
      if (!b) return [g.label, 0, '—', '—', '—', '—', '—', 0];
      return [
        g.label,
        b.n,
        percentText(b.median),
        percentText(b.q1),
        percentText(b.q3),
        percentText(b.lowerWhisker),
        percentText(b.upperWhisker),
        b.outliers.length,
      ];
    }),
  };
}
