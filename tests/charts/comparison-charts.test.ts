import { describe, expect, it } from 'vitest';
import type { ComparisonGroupData } from '@/lib/analysis/types';
import { UNIT_SPACE } from '@/lib/calc/units';
import { compareDriftByPositionChart } from '@/lib/charts/compare-drift-by-position-chart';
import { compareFinalLoadsChart } from '@/lib/charts/compare-final-loads-chart';
import { compareRunCvChart } from '@/lib/charts/compare-run-cv-chart';
import { JITTER_WIDTH } from '@/lib/charts/group-distribution';
import { nutFactorChart } from '@/lib/charts/nut-factor-chart';
import { GROUP_COLOURS } from '@/lib/charts/palette';
import { markNamed } from './support';

const pc = (s: string) => `${s}${UNIT_SPACE}%`;

// Invented groups (Brackwater Bolting School demo style): values hand-made for the checks.
const groups: ComparisonGroupData[] = [
  {
    key: 'dry',
    label: 'Dry',
    colourIndex: 0,
    finalLoadsPercent: [90, 92, 94, 96, 98, 100, 102, 104, 106, 130],
    runCvs: [0.08, 0.06, 0.07],
    meanDriftByPosition: [-6, -5, -4, -5],
  },
  {
    key: 'moly',
    label: 'Moly paste',
    colourIndex: 3,
    finalLoadsPercent: [97, 99, 100, 101, 103],
    runCvs: [0.03, 0.025],
    meanDriftByPosition: [-3, -2, -2, -3, -2, -2, -3, -2],
  },
];

describe('compareFinalLoadsChart', () => {
  const chart = compareFinalLoadsChart(groups, { bandPercent: 5 });

  it('puts one column per group with its label and draws band lines at 100 ± band', () => {
    const x = chart.options.x as { ticks: number[]; tickFormat: (i: number) => string };
    expect(x.ticks).toEqual([0, 1]);
    // Before the drawn width is known the columns carry their keys; fit() adds the whole names.
    expect(x.ticks.map(x.tickFormat)).toEqual(['A', 'B']);
    const wide = chart.fit!(chart.options, { width: 900, fontPx: 13 }).x as { tickFormat: (i: number) => string };
    expect([0, 1].map(wide.tickFormat)).toEqual(['A\nDry', 'B\nMoly paste']);
    expect(markNamed(chart.options, 'target').data).toEqual([100]);
    expect((markNamed(chart.options, 'band lines').data as { y: number }[]).map((b) => b.y)).toEqual([95, 105]);
    expect(chart.options.y?.label).toBe('Final load (% of target)');
  });

  it('jitters dots deterministically inside the column strip, coloured by group slot', () => {
    const dots = markNamed(chart.options, 'values').data as { column: number; x: number; colour: string }[];
    expect(dots).toHaveLength(15);
    const again = markNamed(compareFinalLoadsChart(groups, { bandPercent: 5 }).options, 'values').data;
    expect(again).toEqual(dots);
    for (const d of dots) expect(Math.abs(d.x - d.column)).toBeLessThanOrEqual(JITTER_WIDTH);
    expect(new Set(dots.map((d) => d.x)).size).toBe(15);
    expect(dots[0]!.colour).toBe(GROUP_COLOURS[0]);
    expect(dots[14]!.colour).toBe(GROUP_COLOURS[3]);
  });

  it('boxes use R-7 quartiles and 1.5 IQR whiskers', () => {
    const boxes = markNamed(chart.options, 'boxes').data as { key: string; q1: number; median: number; q3: number; upperWhisker: number; outliers: number[] }[];
    // Dry, n = 10, sorted 90 … 106, 130. R-7 by hand: h = 9p. Q1: h = 2.25 → 94 + 0.25·2 = 94.5;
    // median h = 4.5 → 99; Q3: h = 6.75 → 102 + 0.75·2 = 103.5. IQR 9, upper fence 117 → 130 outlier.
    expect(boxes[0]).toMatchObject({ key: 'dry', q1: 94.5, median: 99, q3: 103.5, upperWhisker: 106, outliers: [130] });
    // Moly, n = 5: h = 1, 2, 3 → 99, 100, 101.
    expect(boxes[1]).toMatchObject({ q1: 99, median: 100, q3: 101 });
    expect(chart.table.rows[0]).toEqual(['Dry', 10, pc('99.0'), pc('94.5'), pc('103.5'), pc('90.0'), pc('106.0'), 1]);
    // Within 95 … 105: 96, 98, 100, 102, 104.
    expect(chart.description).toContain('5 of 10 loads within the band');
  });

  it('has a legend entry per group in its colour', () => {
    expect(chart.legend?.kind).toBe('swatches');
    if (chart.legend?.kind !== 'swatches') return;
    expect(chart.legend.items.slice(0, 2)).toEqual([
      { label: 'A · Dry', colour: GROUP_COLOURS[0], shape: 'dot' },
      { label: 'B · Moly paste', colour: GROUP_COLOURS[3], shape: 'dot' },
    ]);
  });

  it('says how to fill an empty comparison', () => {
    expect(compareFinalLoadsChart([], { bandPercent: 5 }).description).toContain('add runs');
  });
});

describe('compareRunCvChart', () => {
  it('shows run CVs in % per group, with R-7 boxes', () => {
    const chart = compareRunCvChart(groups);
    const dots = markNamed(chart.options, 'values').data as { value: number }[];
    [8, 6, 7, 3, 2.5].forEach((v, i) => expect(dots[i]!.value).toBeCloseTo(v, 12));
    const boxes = markNamed(chart.options, 'boxes').data as { median: number; q1: number }[];
    expect(boxes[0]!.median).toBeCloseTo(7, 12); // 6, 7, 8
    expect(boxes[0]!.q1).toBeCloseTo(6.5, 12); // h = 0.5 → 6 + 0.5
    expect(chart.options.y?.label).toBe('Run CV (%)');
  });
});

describe('compareDriftByPositionChart', () => {
  it('draws one line per group over its positions and tables every position', () => {
    const chart = compareDriftByPositionChart(groups);
    const line = markNamed(chart.options, 'group lines');
    expect((line as unknown as { channels: Record<string, { value: unknown }> }).channels.z!.value).toBe('key');
    expect(line.data).toHaveLength(12);
    expect(chart.table.columns).toEqual(['Position', 'Dry (%)', 'Moly paste (%)']);
    expect(chart.table.rows).toHaveLength(8);
    expect(chart.table.rows[5]).toEqual([6, '—', `−${pc('2.0')}`]);
    expect(chart.options.y?.label).toContain('(%');
  });
});

describe('nutFactorChart', () => {
  it('draws K with its interval per lubricant and tables them', () => {
    const rows = [
      { label: 'Dry', k: 0.2, low: 0.18, high: 0.22, n: 12, colourIndex: 0 },
      { label: 'Moly paste', k: 0.12, low: 0.11, high: 0.135, n: 9, colourIndex: 3 },
    ];
    const chart = nutFactorChart(rows);
    const bars = markNamed(chart.options, 'intervals').data as { low: number; high: number; colour: string }[];
    expect(bars.map((b) => [b.low, b.high])).toEqual([[0.18, 0.22], [0.11, 0.135]]);
    expect(bars[1]!.colour).toBe(GROUP_COLOURS[3]);
    expect((markNamed(chart.options, 'fitted K').data as { k: number }[]).map((r) => r.k)).toEqual([0.2, 0.12]);
    expect(chart.options.x?.label).toContain('Nut factor K');
    expect(chart.table.rows).toEqual([
      ['Dry', '0.200', '0.180', '0.220', 12],
      ['Moly paste', '0.120', '0.110', '0.135', 9],
    ]);
  });
});
