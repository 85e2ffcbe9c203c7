import { describe, expect, it } from 'vitest';
import { useMemo } from 'react';
import { render, screen, within } from '@testing-library/react';
import * as Plot from '@observablehq/plot';
import { PlotFigure } from '@/components/charts/plot-figure';
import { finalLoadsChart } from '@/lib/charts/final-loads-chart';
import { compareFinalLoadsChart } from '@/lib/charts/compare-final-loads-chart';
import { GROUP_COLOURS } from '@/lib/charts/palette';
import { loadsThroughTimeChart } from '@/lib/charts/loads-through-time-chart';
import { driftChart } from '@/lib/charts/drift-chart';
import { reachChart } from '@/lib/charts/reach-chart';
import { passSummaryChart } from '@/lib/charts/pass-summary-chart';
import { compareRunCvChart } from '@/lib/charts/compare-run-cv-chart';
import { compareDriftByPositionChart } from '@/lib/charts/compare-drift-by-position-chart';
import { nutFactorChart } from '@/lib/charts/nut-factor-chart';
import { smallRun } from '../charts/support';

const run = { finalLoadsN: [44_000, 46_000, 50_000, 53_000], targetLoadN: 50_000, bandPercent: 10 };

function FinalLoads() {
  const chart = useMemo(() => finalLoadsChart(run, { units: 'si' }), []);
  return <PlotFigure {...chart} />;
}

describe('PlotFigure', () => {
  it('renders the builder as an SVG under jsdom with a title, a text alternative and the numbers', () => {
    const { container } = render(<FinalLoads />);
    const figure = screen.getByRole('figure', { name: 'Final loads against the band' });
    const img = within(figure).getByRole('img', { name: 'Final loads against the band' });
    expect(img).toHaveAccessibleDescription(/3 of 4 within the band/);
    const svg = img.querySelector('svg');
    expect(svg).not.toBeNull();
    // The deviation colours reach the SVG as literal fills (Plot passes var()/color-mix() through).
    const fills = [...svg!.querySelectorAll('circle')].map((c) => c.getAttribute('fill'));
    expect(fills).toContain('var(--el-on)');
    expect(fills.some((f) => f?.startsWith('color-mix(in oklab, var(--el-below)'))).toBe(true);
    expect(svg!.textContent).toContain('Final load (kN)');
    const details = container.querySelector('details')!;
    expect(within(details).getByText('Show the numbers')).toBeInTheDocument();
    expect(within(details).getAllByRole('row')).toHaveLength(5);
    expect(within(details).getByRole('cell', { name: '44.0\u00a0kN' })).toBeInTheDocument();
    expect(screen.getByRole('group', { name: /Colour scale: below target to above target/ })).toBeInTheDocument();
  });

  it('removes the plot on unmount and builds a fresh one when the options change', () => {
    const a = finalLoadsChart(run, { units: 'si' });
    const { rerender, unmount, getByTestId } = render(<PlotFigure {...a} />);
    const container = getByTestId('plot-container');
    const first = container.querySelector('svg')!;
    expect(first.isConnected).toBe(true);
    const b = finalLoadsChart(run, { units: 'us' });
    rerender(<PlotFigure {...b} />);
    expect(first.isConnected).toBe(false);
    expect(container.querySelectorAll('svg')).toHaveLength(1);
    expect(container.textContent).toContain('Final load (lbf)');
    const second = container.querySelector('svg')!;
    unmount();
    expect(second.isConnected).toBe(false);
  });

  it('Plot.plot accepts every comparison mark under jsdom and keeps group colours as given', () => {
    const chart = compareFinalLoadsChart(
      [{ key: 'dry', label: 'Dry', colourIndex: 2, finalLoadsPercent: [95, 100, 104], runCvs: [], meanDriftByPosition: [] }],
      { bandPercent: 5 },
    );
    const plot = Plot.plot({ ...chart.options, width: 400 });
    const fills = [...plot.querySelectorAll('circle')].map((c) => c.getAttribute('fill'));
    expect(fills).toEqual([GROUP_COLOURS[2], GROUP_COLOURS[2], GROUP_COLOURS[2]]);
    expect(plot.textContent).toContain('Dry');
    plot.remove();
  });

  it('every builder yields options Plot.plot renders under jsdom, with the axis labels in the SVG', () => {
    const r = smallRun();
    const groups = [
      { key: 'dry', label: 'Dry', colourIndex: 0, finalLoadsPercent: [92, 99, 104], runCvs: [0.05, 0.07], meanDriftByPosition: [-4, -3, -5, -4] },
      { key: 'wet', label: 'Moly paste', colourIndex: 1, finalLoadsPercent: [98, 100, 101], runCvs: [0.02, 0.03], meanDriftByPosition: [-2, -2, -3, -2] },
    ];
    const cases = [
      [loadsThroughTimeChart(r, { units: 'si', currentStep: 5 }), 'Stud load (kN)'],
      [driftChart(r, { units: 'us' }), 'Drift (% of load after last tightening)'],
      [reachChart(r.reach), 'Change per unit load added at distance k'],
      [passSummaryChart(r.passes), 'Percent (%)'],
      [compareRunCvChart(groups), 'Run CV (%)'],
      [compareDriftByPositionChart(groups), 'Mean drift'],
      [nutFactorChart([{ label: 'Dry', k: 0.2, low: 0.18, high: 0.22, n: 12, colourIndex: 0 }]), 'Nut factor K'],
    ] as const;
    for (const [chart, label] of cases) {
      const plot = Plot.plot({ ...chart.options, width: 600 });
      expect(plot.tagName.toLowerCase()).toBe('svg');
      expect(plot.textContent).toContain(label);
      plot.remove();
    }
  });
});
