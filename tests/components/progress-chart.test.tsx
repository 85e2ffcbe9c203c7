import * as Plot from '@observablehq/plot';
import { describe, expect, it, vi } from 'vitest';
import { progressChartOptions, progressData } from '@/lib/charts/progress-chart';

const points = [
  { attempt: 1, cvPercent: 9.1, largestDeviationPercent: 18.2 },
  { attempt: 2, cvPercent: null, largestDeviationPercent: 11 },
  { attempt: 3, cvPercent: 3.2, largestDeviationPercent: 6.4 },
];

describe('progress chart', () => {
  it('turns attempts into one row per measure and leaves missing figures out', () => {
    const data = progressData(points);
    expect(data).toHaveLength(5);
    expect(data.filter((d) => d.measure === 'CV of final loads').map((d) => d.attempt)).toEqual([1, 3]);
  });

  it('has axis labels with units, keeps the deviation hues for deviation only, and renders without Plot warnings', () => {
    const options = progressChartOptions(points, { cvPercent: 5, bandPercent: 10 });
    // The visible title is the figure's (components/charts/progress-chart.tsx), not a second one inside the plot.
    expect(options.title).toBeUndefined();
    // Below/above-target hues mean load deviation on every screen (PRODUCT.md): the two measures take group colours.
    const range = (options.color as { range: string[] }).range;
    expect(range).not.toContain('var(--el-below)');
    expect(range).not.toContain('var(--el-above)');
    expect((options.x as { label: string }).label).toBe('Attempt (number)');
    expect((options.y as { label: string }).label).toBe('Percent (%)');
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    for (const set of [points, points.slice(0, 1)]) {
      const figure = Plot.plot({ ...progressChartOptions(set, { cvPercent: 5, bandPercent: 10 }), document });
      expect(figure.textContent).toContain('CV limit 5 %');
      expect(figure.textContent).toContain('Band ±10 %');
    }
    expect(warn).not.toHaveBeenCalled();
    warn.mockRestore();
  });
});
