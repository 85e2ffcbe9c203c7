import { describe, expect, it } from 'vitest';
import { nToLbf, UNIT_SPACE } from '@/lib/calc/units';
import { finalLoadsChart } from '@/lib/charts/final-loads-chart';
import { markNamed } from './support';

const run = { finalLoadsN: [44_000, 46_000, 50_000, 53_000], targetLoadN: 50_000, bandPercent: 10 };

describe('finalLoadsChart', () => {
  it('draws the band, the target, stems and one dot per stud in kN with the unit on the axis', () => {
    const chart = finalLoadsChart(run, { units: 'si' });
    const band = markNamed(chart.options, 'band');
    expect(band.constructor.name).toBe('Rect');
    const [span] = band.data as { y1: number; y2: number }[]; // 50 kN ± 10 %
    expect(span!.y1).toBeCloseTo(45, 9);
    expect(span!.y2).toBeCloseTo(55, 9);
    expect(markNamed(chart.options, 'target').data).toEqual([50]);
    const dots = markNamed(chart.options, 'final loads').data as { position: number; load: number; colour: string }[];
    expect(dots.map((d) => [d.position, d.load])).toEqual([[1, 44], [2, 46], [3, 50], [4, 53]]);
    expect(dots[2]!.colour).toBe('var(--el-on)');
    expect(dots[0]!.colour).toContain('var(--el-below)'); // −12 % with band 10: 60 % towards below
    expect(dots[3]!.colour).toContain('var(--el-above)');
    expect(chart.options.y?.label).toBe('Final load (kN)');
    expect(chart.options.x?.label).toBe('Stud position');
    expect(chart.legend).toEqual({ kind: 'deviation', bandPercent: 10 });
  });

  it('plots in lbf for US units (1 lbf = 4.4482216152605 N exactly)', () => {
    const chart = finalLoadsChart(run, { units: 'us' });
    expect(chart.options.y?.label).toBe('Final load (lbf)');
    const dots = markNamed(chart.options, 'final loads').data as { load: number }[];
    expect(dots[0]!.load).toBeCloseTo(44_000 / 4.4482216152605, 9);
    expect(dots[0]!.load).toBeCloseTo(nToLbf(44_000), 9);
  });

  it('tables every stud with load, % of target and deviation, and says it in words', () => {
    const chart = finalLoadsChart(run, { units: 'si' });
    expect(chart.table.columns).toEqual(['Position', 'Final load', '% of target', 'Deviation', 'Within band']);
    expect(chart.table.rows).toEqual([
      [1, `44.0${UNIT_SPACE}kN`, `88.0${UNIT_SPACE}%`, `12.0${UNIT_SPACE}% below`, 'no'],
      [2, `46.0${UNIT_SPACE}kN`, `92.0${UNIT_SPACE}%`, `8.0${UNIT_SPACE}% below`, 'yes'],
      [3, `50.0${UNIT_SPACE}kN`, `100.0${UNIT_SPACE}%`, 'on target', 'yes'],
      [4, `53.0${UNIT_SPACE}kN`, `106.0${UNIT_SPACE}%`, `6.0${UNIT_SPACE}% above`, 'yes'],
    ]);
    expect(chart.title).toBeTruthy();
    expect(chart.description).toContain('3 of 4 within the band');
    expect(chart.description).toContain('lowest 44.0');
    expect(chart.description).toContain('position 1');
  });

  it('keeps a missing reading in the table and leaves it out of the marks', () => {
    const chart = finalLoadsChart({ ...run, finalLoadsN: [44_000, Number.NaN, 50_000, 53_000] }, { units: 'si' });
    expect(markNamed(chart.options, 'final loads').data).toHaveLength(3);
    expect(chart.table.rows[1]).toEqual([2, '—', '—', 'no reading', '—']);
    expect(chart.description).toContain('1 studs have no reading');
  });
});
