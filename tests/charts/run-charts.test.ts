import { describe, expect, it } from 'vitest';
import { UNIT_SPACE } from '@/lib/calc/units';
import { driftChart } from '@/lib/charts/drift-chart';
import { passSummaryChart } from '@/lib/charts/pass-summary-chart';
import { reachChart, Z_95 } from '@/lib/charts/reach-chart';
import { markNamed, smallRun } from './support';

const pc = (s: string) => `${s}${UNIT_SPACE}%`;

describe('driftChart', () => {
  it('draws a bar per stud from zero, loss in the below hue, with a zero rule', () => {
    const chart = driftChart(smallRun(), { units: 'si' });
    const bars = markNamed(chart.options, 'drift');
    expect(bars.constructor.name).toBe('BarY');
    const data = bars.data as { position: number; driftPercent: number; colour: string }[];
    expect(data.map((d) => d.driftPercent)).toEqual([-12, -8, -6, 0]);
    // −12 % with band 10 %: 12 / (2 × 10) = 60 % of the way to the below hue.
    expect(data[0]!.colour).toBe('color-mix(in oklab, var(--el-below) 60%, var(--el-on))');
    expect(data[3]!.colour).toBe('var(--el-on)');
    expect(markNamed(chart.options, 'zero').data).toEqual([0]);
    expect(chart.options.y?.label).toContain('(%');
    expect(chart.legend).toMatchObject({ kind: 'deviation', labels: { below: 'lost load' } });
  });

  it('tables loads with units and signed drift', () => {
    const chart = driftChart(smallRun(), { units: 'si' });
    expect(chart.table.rows[0]).toEqual([1, `50.0${UNIT_SPACE}kN`, `44.0${UNIT_SPACE}kN`, `−${pc('12.0')}`]);
    expect(chart.table.rows[3]![3]).toBe(pc('0.0'));
    expect(chart.description).toContain('3 lost load');
  });
});

describe('reachChart', () => {
  it('draws ±1.96 SE error bars, a zero rule and the axis wording', () => {
    const chart = reachChart(smallRun().reach);
    const bars = markNamed(chart.options, 'error bars').data as { distance: number; low: number; high: number }[];
    // Distance 1: −0.12 ± 1.96 × 0.02 = −0.1592 … −0.0808 (hand).
    expect(bars[0]!.low).toBeCloseTo(-0.1592, 12);
    expect(bars[0]!.high).toBeCloseTo(-0.0808, 12);
    expect(Z_95).toBe(1.96);
    expect(markNamed(chart.options, 'zero').data).toEqual([0]);
    expect(chart.options.y?.label).toContain('Change per unit load added at distance k');
    expect(chart.options.x?.label).toContain('Distance k');
    expect(chart.table.rows).toEqual([
      [1, '−0.120', '0.0200', '−0.159', '−0.0808', 16],
      [2, '−0.0400', '0.0300', '−0.0988', '0.0188', 8],
    ]);
    expect(chart.description).toContain('Intervals crossing zero: 2');
  });
});

describe('passSummaryChart', () => {
  it('draws the CV after each pass as line and dots, and the mean change as bars, in %', () => {
    const chart = passSummaryChart(smallRun().passes);
    expect(markNamed(chart.options, 'CV line').constructor.name).toBe('Line');
    const dots = markNamed(chart.options, 'CV').data as { cvPercent: number }[];
    expect(dots[0]!.cvPercent).toBeCloseTo(5.8, 12);
    expect(dots[1]!.cvPercent).toBeCloseTo(6.3, 12);
    const bars = markNamed(chart.options, 'mean change').data as { meanLossPercent: number }[];
    expect(bars.map((b) => b.meanLossPercent)).toEqual([-6.7, -6.5]);
    expect(chart.options.y?.label).toBe('Percent (%)');
    expect(chart.table.rows).toEqual([
      [`Pass 1 (${pc('30')})`, pc('5.8'), `−${pc('6.7')}`],
      [`Pass 2 (${pc('100')})`, pc('6.3'), `−${pc('6.5')}`],
    ]);
  });
});
