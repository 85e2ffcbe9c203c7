import * as Plot from '@observablehq/plot';
import { formatDecimals } from '@/lib/calc/units';
import type { ChartSpec } from './chart-spec';
import { GROUP_COLOURS } from './palette';

/** One session's result for one position. */
export interface CalibrationHistoryPoint {
  session: number;
  performedOn: string;
  factor: number;
  lower: number;
  upper: number;
  accepted: boolean;
  drift: boolean;
}

const status = (p: CalibrationHistoryPoint) => (p.drift ? 'drift' : p.accepted ? 'accepted' : 'refused');

/**
 * A position's calibration factor session by session with its 95 % interval as a vertical line;
 * drift (a factor outside the previous accepted interval) and refused sessions are marked. Sessions
 * are numbered on the x axis (their dates are in the table), so labels never crowd.
 */
export function calibrationHistoryChart(position: number, points: readonly CalibrationHistoryPoint[]): ChartSpec {
  const values = points.flatMap((p) => [p.lower, p.upper, p.factor]);
  const lo = Math.min(1, ...values);
  const hi = Math.max(1, ...values);
  const pad = Math.max(0.005, (hi - lo) * 0.15);
  const colours = { accepted: GROUP_COLOURS[0], refused: GROUP_COLOURS[2], drift: GROUP_COLOURS[1] };
  return {
    options: {
      height: 260,
      marginLeft: 56,
      x: { label: 'Calibration session (number)', tickFormat: 'd', ticks: Math.min(points.length, 10), domain: [0.5, Math.max(1, points.length) + 0.5] },
      y: { label: 'Calibration factor', grid: true, domain: [lo - pad, hi + pad] },
      marks: [
        Plot.ruleY([1], { stroke: 'var(--el-muted)', strokeDasharray: '4 3' }),
        Plot.ruleX(points, { x: 'session', y1: 'lower', y2: 'upper', stroke: (p: CalibrationHistoryPoint) => colours[status(p)], strokeWidth: 2 }),
        Plot.dot(points, { x: 'session', y: 'factor', r: 4, fill: (p: CalibrationHistoryPoint) => colours[status(p)], symbol: (p: CalibrationHistoryPoint) => (p.drift ? 'triangle' : 'circle') }),
      ],
    },
    title: `Position ${position}: factor over calibrations`,
    description: `The calibration factor of position ${position} at each session with its 95 % interval. A triangle marks drift: a factor outside the previous accepted interval.`,
    legend: {
      kind: 'swatches',
      items: [
        { label: 'Accepted', colour: colours.accepted, shape: 'dot' },
        { label: 'Drift', colour: colours.drift, shape: 'dot' },
        { label: 'Refused', colour: colours.refused, shape: 'dot' },
      ],
    },
    table: {
      columns: ['Session', 'Date', 'Factor', '95 % interval', 'Status'],
      rows: points.map((p) => [p.session, p.performedOn, formatDecimals(p.factor, 4), `${formatDecimals(p.lower, 4)} – ${formatDecimals(p.upper, 4)}`, status(p)]),
    },
  };
}
