import * as Plot from '@observablehq/plot';
import type { UnitSystem } from '@/lib/calc/units';
import type { RunAnalysis } from '@/lib/analysis/types';
import type { ChartFit, ChartSpec } from './chart-spec';
import { textWidth, wrapWords } from './label-layout';
import { chartForceText, forceUnit, percentText, toChartForce } from './chart-format';
import { deviationColour, THEME } from './palette';
import { basePlotOptions } from './plot-theme';
import { readStud } from './stud-reading';

export type FinalLoadsInput = Pick<RunAnalysis, 'finalLoadsN' | 'targetLoadN' | 'bandPercent'>;

export interface FinalLoadsOptions {
  units: UnitSystem;
}

interface StudPoint {
  position: number;
  load: number;
  colour: string;
  title: string;
}

/**
 * Final load per stud position against the target line and the band (target ± band %). Each stud
 * is a dot on a stem from the target line, filled by the diverging deviation scale; y in kN or lbf.
 * The y axis is zoomed around the target (it does not start at zero) so a few % show clearly; the
 * description says so.
 */
export function finalLoadsChart(run: FinalLoadsInput, { units }: FinalLoadsOptions): ChartSpec {
  const { finalLoadsN, targetLoadN, bandPercent } = run;
  const unit = forceUnit(units);
  const target = toChartForce(targetLoadN, units);
  const bandLow = target * (1 - bandPercent / 100);
  const bandHigh = target * (1 + bandPercent / 100);
  const readings = finalLoadsN.map((loadN, i) => readStud(i + 1, loadN, targetLoadN, units));
  const points: StudPoint[] = finalLoadsN.map((loadN, i) => ({
    position: i + 1,
    load: toChartForce(loadN, units),
    colour: deviationColour(readings[i]!.deviationPercent, bandPercent),
    title: readings[i]!.sentence,
  }));
  const finite = points.filter((p) => Number.isFinite(p.load));
  const values = [...finite.map((p) => p.load), bandLow, bandHigh];
  const pad = (Math.max(...values) - Math.min(...values)) * 0.12 || target * 0.05;
  const yDomain: [number, number] = [Math.min(...values) - pad, Math.max(...values) + pad];
  const within = readings.filter((r) => Math.abs(r.deviationPercent) <= bandPercent).length;
  const lowest = finite.length ? finite.reduce((a, b) => (b.load < a.load ? b : a)) : undefined;
  const highest = finite.length ? finite.reduce((a, b) => (b.load > a.load ? b : a)) : undefined;
  const missing = points.length - finite.length;

  const targetText = `Target ${chartForceText(targetLoadN, units)} ± ${percentText(bandPercent)} (line and band)`;
  const yLabel = `Final load (${unit})`;
  const options = basePlotOptions({
    marginTop: 34,
    x: {
      label: 'Stud position',
      domain: points.map((p) => p.position),
      type: 'point',
      padding: 0.6,
      labelAnchor: 'center',
      labelArrow: 'none',
    },
    y: { label: yLabel, domain: yDomain, grid: true, labelArrow: 'none', nice: false },
    marks: [
      Plot.rectY([{ y1: bandLow, y2: bandHigh }], {
        y1: 'y1',
        y2: 'y2',
        fill: THEME.on,
        fillOpacity: 0.35,
        ariaDescription: 'band',
      }),
      Plot.ruleY([target], { stroke: THEME.ink, strokeWidth: 1.5, ariaDescription: 'target' }),
      Plot.ruleX(finite, {
        x: 'position',
        y1: () => target,
        y2: 'load',
        stroke: THEME.muted,
        strokeWidth: 1,
        ariaDescription: 'stems',
      }),
      Plot.dot(finite, {
        x: 'position',
        y: 'load',
        r: 7,
        fill: 'colour',
        stroke: THEME.ink,
        strokeWidth: 1,
        title: 'title',
        ariaDescription: 'final loads',
      }),
    ],
  });

  // The target is named above the plot (top right, in the margin) so the name never sits under a
  // stud's dot; on a narrow chart it wraps so it stays clear of the axis label at the top left.
  const targetLabel = (text: string) =>
    Plot.text([target], { frameAnchor: 'top-right', textAnchor: 'end', lineAnchor: 'bottom', dy: -8, text: () => text, fill: THEME.muted, ariaDescription: 'target label' });
  options.marks = [...(options.marks ?? []), targetLabel(targetText)];
  const fit: ChartFit = (opts, { width, fontPx }) => {
    const room = width - (opts.marginRight ?? 0) - textWidth(yLabel, fontPx) - 24;
    const lines = textWidth(targetText, fontPx) <= room ? [targetText] : wrapWords(targetText, Math.max(room, 80), fontPx);
    const marks = (opts.marks ?? []).filter((m) => (m as { ariaDescription?: string }).ariaDescription !== 'target label');
    return { ...opts, marginTop: Math.max(opts.marginTop ?? 0, Math.ceil(14 + lines.length * fontPx * 1.1)), marks: [...marks, targetLabel(lines.join('\n'))] };
  };

  const description =
    finite.length === 0
      ? `No final loads were recorded for ${points.length} studs.`
      : `Final loads of ${points.length} studs against a target of ${chartForceText(targetLoadN, units)} ± ${percentText(bandPercent)}: ` +
        `${within} of ${points.length} within the band; lowest ${readings[lowest!.position - 1]!.loadText} at position ${lowest!.position} ` +
        `(${readings[lowest!.position - 1]!.percentOfTargetText} of target), highest ${readings[highest!.position - 1]!.loadText} ` +
        `at position ${highest!.position} (${readings[highest!.position - 1]!.percentOfTargetText} of target).` +
        (missing ? ` ${missing} studs have no reading.` : '') +
        ' The load axis does not start at zero.';

  return {
    title: 'Final loads against the band',
    fit,
    description,
    options,
    legend: { kind: 'deviation', bandPercent },
    table: {
      columns: ['Position', `Final load`, '% of target', 'Deviation', 'Within band'],
      rows: readings.map((r) => [
        r.position,
        r.loadText,
        r.percentOfTargetText,
        r.deviationText,
        Number.isFinite(r.deviationPercent) ? (Math.abs(r.deviationPercent) <= bandPercent ? 'yes' : 'no') : '—',
      ]),
    },
  };
}
