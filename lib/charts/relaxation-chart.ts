import * as Plot from '@observablehq/plot';
import type { HoldRelaxation } from '@/lib/analysis/relaxation';
import { formatNumber } from '@/lib/calc/units';
import type { ChartSpec } from './chart-spec';
import { percentText } from './chart-format';
import { THEME } from './palette';
import { basePlotOptions } from './plot-theme';

interface Row {
  stud: number;
  minutes: number;
  lost: number;
}

/** "0 min", "10 min", "1.5 h": an elapsed time for labels and the table. */
export function elapsedText(seconds: number): string {
  return seconds >= 3600 ? `${formatNumber(seconds / 3600, 3)} h` : `${formatNumber(seconds / 60, 3)} min`;
}

/**
 * Relaxation during one hold: each stud's load lost since the end of the pass, in % of its load then,
 * against the time since (a thin line per stud, the mean of the studs as a thick line with dots).
 */
export function relaxationChart(holds: readonly HoldRelaxation[]): ChartSpec {
  const studRows: Row[] = holds.flatMap((h) => h.lostPercent.flatMap((lost, i) => (lost === null ? [] : [{ stud: i + 1, minutes: h.elapsedS / 60, lost }])));
  const meanRows: Row[] = holds.flatMap((h) => (h.meanLostPercent === null ? [] : [{ stud: 0, minutes: h.elapsedS / 60, lost: h.meanLostPercent }]));
  const last = holds[holds.length - 1];
  const studCount = holds[0]?.loadsN.length ?? 0;
  const description = !last
    ? 'No hold readings were recorded for this run.'
    : `Load lost since the end of pass ${last.afterPass}, in % of each stud's load then, at ${holds.length} times up to ${elapsedText(last.elapsedS)}: ` +
      `mean ${holds.map((h) => `${elapsedText(h.elapsedS)} ${h.meanLostPercent === null ? '—' : percentText(h.meanLostPercent)}`).join(', ')}.`;
  return {
    title: `Relaxation during the hold after pass ${last?.afterPass ?? '—'}`,
    description,
    options: basePlotOptions({
      x: { label: 'Time since the end of the pass (min)', grid: true, nice: true, labelArrow: 'none' },
      y: { label: 'Load lost (%)', grid: true, nice: true, labelArrow: 'none' },
      marks: [
        Plot.ruleY([0], { stroke: THEME.ink, strokeWidth: 1, ariaDescription: 'zero' }),
        Plot.line(studRows, { x: 'minutes', y: 'lost', z: 'stud', stroke: THEME.muted, strokeWidth: 1, ariaDescription: 'each stud' }),
        Plot.line(meanRows, { x: 'minutes', y: 'lost', stroke: THEME.ink, strokeWidth: 2.5, ariaDescription: 'mean of the studs' }),
        Plot.dot(meanRows, { x: 'minutes', y: 'lost', r: 4, fill: THEME.ink, title: (r: Row) => `${elapsedText(r.minutes * 60)}: mean ${percentText(r.lost)} lost`, ariaDescription: 'mean' }),
      ],
    }),
    legend: {
      kind: 'swatches',
      items: [
        { label: 'Each stud', colour: THEME.muted, shape: 'line' },
        { label: 'Mean of the studs', colour: THEME.ink, shape: 'line' },
      ],
    },
    table: {
      columns: ['Time', 'Mean lost', ...Array.from({ length: studCount }, (_, i) => `Stud ${i + 1}`)],
      rows: holds.map((h) => [elapsedText(h.elapsedS), h.meanLostPercent === null ? '—' : percentText(h.meanLostPercent), ...h.lostPercent.map((x) => (x === null ? '—' : percentText(x)))]),
    },
  };
}
