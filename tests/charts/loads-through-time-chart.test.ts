import { describe, expect, it } from 'vitest';
import { UNIT_SPACE } from '@/lib/calc/units';
import { loadsThroughTimeChart, passBoundaries } from '@/lib/charts/loads-through-time-chart';
import { markLabels, markNamed, smallRun } from './support';

describe('loadsThroughTimeChart', () => {
  it('draws every stud after every step, one line per stud, y in kN', () => {
    const run = smallRun();
    const chart = loadsThroughTimeChart(run, { units: 'si' });
    const lines = markNamed(chart.options, 'stud loads');
    expect(lines.constructor.name).toBe('Line');
    expect(lines.data).toHaveLength(8 * 4);
    expect((lines as unknown as { channels: Record<string, { value: unknown }> }).channels.z!.value).toBe('position');
    expect(chart.options.y?.label).toBe('Stud load (kN)');
    expect(chart.options.x?.label).toBe('Step');
  });

  it('marks the tightened stud of each step on its line', () => {
    const chart = loadsThroughTimeChart(smallRun(), { units: 'si' });
    const dots = markNamed(chart.options, 'tightened stud').data as { step: number; position: number; load: number }[];
    expect(dots.map((d) => [d.step, d.position, d.load])).toEqual([
      [1, 1, 15], [2, 2, 15], [3, 3, 15], [4, 4, 15], [5, 1, 50], [6, 2, 50], [7, 3, 50], [8, 4, 51],
    ]);
  });

  it('puts one boundary between two passes, labelled with the pass level', () => {
    const run = smallRun();
    expect(passBoundaries(run)).toEqual([{ pass: 2, x: 4.5, label: `Pass 2 (100${UNIT_SPACE}%)` }]);
    const chart = loadsThroughTimeChart(run, { units: 'si' });
    expect(markNamed(chart.options, 'pass boundaries').data).toHaveLength(1);
    const labels = (markNamed(chart.options, 'pass labels').data as { label: string }[]).map((l) => l.label);
    expect(labels).toEqual([`Pass 1 (30${UNIT_SPACE}%)`, `Pass 2 (100${UNIT_SPACE}%)`]);
  });

  it('counts boundaries for three passes and labels an unknown level "Pass n"', () => {
    const run = smallRun();
    const steps = [...run.steps, ...run.steps.slice(4).map((s, i) => ({ ...s, order: 9 + i, pass: 3 }))];
    const b = passBoundaries({ steps, passes: run.passes });
    expect(b.map((x) => [x.x, x.label])).toEqual([[4.5, `Pass 2 (100${UNIT_SPACE}%)`], [8.5, 'Pass 3']]);
  });

  it('replay: draws a cursor at the current step and dims what comes after', () => {
    const chart = loadsThroughTimeChart(smallRun(), { units: 'si', currentStep: 3 });
    expect(markNamed(chart.options, 'current step').data).toEqual([3]);
    expect((markNamed(chart.options, 'stud loads').data as { step: number }[]).every((p) => p.step <= 3)).toBe(true);
    const ahead = markNamed(chart.options, 'stud loads after the current step');
    expect((ahead as unknown as { strokeOpacity: number }).strokeOpacity).toBeLessThan(0.3);
    expect((ahead.data as { step: number }[]).every((p) => p.step >= 3)).toBe(true);
    expect(markNamed(chart.options, 'tightened stud').data).toHaveLength(3);
    expect(chart.description).toContain('Replay at step 3');
    expect(markLabels(loadsThroughTimeChart(smallRun(), { units: 'si' }).options)).not.toContain('current step');
  });

  it('rejects a replay step outside the run', () => {
    expect(() => loadsThroughTimeChart(smallRun(), { units: 'si', currentStep: 9 })).toThrow(
      'currentStep must be a whole step between 1 and 8 (got 9)',
    );
  });

  it('tables each step with the tightened stud and every load, unit in the headers; lbf for US', () => {
    const chart = loadsThroughTimeChart(smallRun(), { units: 'us' });
    expect(chart.table.columns).toEqual(['Step', 'Pass', 'Stud tightened', 'Stud 1 (lbf)', 'Stud 2 (lbf)', 'Stud 3 (lbf)', 'Stud 4 (lbf)']);
    expect(chart.table.rows).toHaveLength(8);
    // 50 000 N / 4.4482216152605 N per lbf = 11 240.4 lbf → "11,240" (units.ts keeps whole units).
    expect(chart.table.rows[4]).toEqual([5, 2, 1, '11,240', '2,923', '2,923', '3,147']);
    expect(chart.options.y?.label).toBe('Stud load (lbf)');
  });
});
