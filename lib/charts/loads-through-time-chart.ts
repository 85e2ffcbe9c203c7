import * as Plot from '@observablehq/plot';
import type { UnitSystem } from '@/lib/calc/units';
import type { RunAnalysis } from '@/lib/analysis/types';
import { AppError } from '@/lib/http/errors';
import type { ChartFit, ChartSpec } from './chart-spec';
import { chartForceText, forceUnit, numberText, passLabel, percentText, toChartForce } from './chart-format';
import { THEME } from './palette';
import { basePlotOptions } from './plot-theme';
import { dodge, layoutRowLabels, textWidth } from './label-layout';

export type LoadsThroughTimeInput = Pick<RunAnalysis, 'steps' | 'passes' | 'targetLoadN' | 'bandPercent'>;

export interface LoadsThroughTimeOptions {
  units: UnitSystem;
  /** Replay: the step shown as "now" (1-based step order). Steps after it are dimmed. */
  currentStep?: number;
}

export interface StudLoadPoint {
  step: number;
  pass: number;
  position: number;
  load: number;
  tightened: boolean;
  title: string;
}

export interface PassBoundary {
  pass: number;
  /** Drawn half-way between the last step of the previous pass and the first of this one. */
  x: number;
  label: string;
}

/** Every stud's load after every step, one line per stud, in the chart's force unit. */
export function studLoadPoints(steps: RunAnalysis['steps'], units: UnitSystem): StudLoadPoint[] {
  return steps.flatMap((step) =>
    step.loadsN.map((loadN, i) => ({
      step: step.order,
      pass: step.pass,
      position: i + 1,
      load: toChartForce(loadN, units),
      tightened: step.position === i + 1,
      title: `Step ${step.order} (pass ${step.pass}), stud ${i + 1}: ${chartForceText(loadN, units)}${
        step.position === i + 1 ? ' — tightened in this step' : ''
      }`,
    })),
  );
}

/** Where each pass after the first begins, with its label "Pass 2 (60 %)". */
export function passBoundaries(run: Pick<RunAnalysis, 'steps' | 'passes'>): PassBoundary[] {
  const boundaries: PassBoundary[] = [];
  for (let i = 1; i < run.steps.length; i += 1) {
    const prev = run.steps[i - 1]!;
    const step = run.steps[i]!;
    if (step.pass !== prev.pass) {
      const level = run.passes.find((p) => p.pass === step.pass)?.percentOfTarget;
      boundaries.push({ pass: step.pass, x: (prev.order + step.order) / 2, label: passLabel(step.pass, level) });
    }
  }
  return boundaries;
}

/**
 * Loads through time: x = step, y = load; a thin line per stud, the stud tightened at each step
 * marked with an accent dot on its line, pass boundaries as rules labelled "Pass 2 (60 %)", the
 * target line and band. With `currentStep` (replay) a cursor marks that step and everything after
 * it is dimmed.
 */
export function loadsThroughTimeChart(run: LoadsThroughTimeInput, options: LoadsThroughTimeOptions): ChartSpec {
  const { units, currentStep } = options;
  const { steps, targetLoadN, bandPercent } = run;
  const lastStep = steps.length ? steps[steps.length - 1]!.order : 0;
  if (currentStep !== undefined && (!Number.isInteger(currentStep) || currentStep < 1 || currentStep > lastStep)) {
    throw new AppError('invalid_input', `currentStep must be a whole step between 1 and ${lastStep} (got ${currentStep})`, {
      field: 'currentStep',
    });
  }
  const unit = forceUnit(units);
  const target = toChartForce(targetLoadN, units);
  const points = studLoadPoints(steps, units).filter((p) => Number.isFinite(p.load));
  const boundaries = passBoundaries(run);
  const firstPass = steps[0];
  const firstLabel = firstPass
    ? { x: firstPass.order - 0.5, label: passLabel(firstPass.pass, run.passes.find((p) => p.pass === firstPass.pass)?.percentOfTarget) }
    : undefined;
  const now = currentStep ?? lastStep;
  const done = points.filter((p) => p.step <= now);
  const ahead = currentStep === undefined ? [] : points.filter((p) => p.step >= now);
  const tightenedDone = done.filter((p) => p.tightened);
  const tightenedAhead = ahead.filter((p) => p.tightened && p.step > now);
  const studCount = steps[0]?.loadsN.length ?? 0;
  const endLabels = done.filter((p) => p.step === now);

  const marks: Plot.Markish[] = [
    Plot.rectY([{ y1: target * (1 - bandPercent / 100), y2: target * (1 + bandPercent / 100) }], {
      y1: 'y1',
      y2: 'y2',
      fill: THEME.on,
      fillOpacity: 0.3,
      ariaDescription: 'band',
    }),
    Plot.ruleY([target], { stroke: THEME.ink, strokeWidth: 1, strokeDasharray: '4 3', ariaDescription: 'target' }),
    Plot.ruleY([0], { stroke: THEME.ink, strokeWidth: 1, ariaDescription: 'zero' }),
    Plot.ruleX(boundaries, { x: 'x', stroke: THEME.muted, strokeWidth: 1, ariaDescription: 'pass boundaries' }),
    Plot.lineY(done, {
      x: 'step',
      y: 'load',
      z: 'position',
      stroke: THEME.ink,
      strokeOpacity: 0.55,
      strokeWidth: 1.25,
      curve: 'step-after',
      ariaDescription: 'stud loads',
    }),
  ];
  if (ahead.length) {
    marks.push(
      Plot.lineY(ahead, {
        x: 'step',
        y: 'load',
        z: 'position',
        stroke: THEME.ink,
        strokeOpacity: 0.15,
        strokeWidth: 1,
        curve: 'step-after',
        ariaDescription: 'stud loads after the current step',
      }),
      Plot.dot(tightenedAhead, { x: 'step', y: 'load', r: 3, fill: THEME.muted, fillOpacity: 0.3, ariaDescription: 'later tightened studs' }),
    );
  }
  marks.push(
    Plot.dot(tightenedDone, {
      x: 'step',
      y: 'load',
      r: 4.5,
      fill: THEME.accent,
      stroke: THEME.paper,
      strokeWidth: 1,
      title: 'title',
      ariaDescription: 'tightened stud',
    }),
  );
  if (currentStep !== undefined) {
    marks.push(Plot.ruleX([currentStep], { stroke: THEME.accent, strokeWidth: 2, ariaDescription: 'current step' }));
  }

  const passLabels = [...(firstLabel ? [firstLabel] : []), ...boundaries];
  const yMax = niceCeil(Math.max(target * (1 + (2 * bandPercent) / 100), ...points.map((p) => p.load)));
  const fit: ChartFit = (opts, frame) => {
    // Room above the frame for two rows of pass names, below it for the ticks and the axis label.
    const sized = {
      ...opts,
      marginTop: Math.max(opts.marginTop ?? 0, 2 * (frame.fontPx + 2) + 10),
      marginBottom: Math.max(opts.marginBottom ?? 0, Math.ceil(2.4 * frame.fontPx + 14)),
    };
    return { ...sized, marks: [...marks, ...labelMarks(sized, frame, passLabels, endLabels)] };
  };

  const passCount = new Set(steps.map((s) => s.pass)).size;
  const description =
    steps.length === 0
      ? 'No steps were recorded for this run.'
      : `Loads of ${studCount} studs after each of ${steps.length} steps in ${passCount} ${passCount === 1 ? 'pass' : 'passes'}` +
        `, against a target of ${chartForceText(targetLoadN, units)} ± ${percentText(bandPercent)}.` +
        (boundaries.length ? ` Passes begin at steps ${[steps[0]!.order, ...boundaries.map((b) => Math.ceil(b.x))].join(', ')}.` : '') +
        (currentStep !== undefined ? ` Replay at step ${currentStep}; later steps are dimmed.` : '') +
        ' The dot marks the stud tightened in each step; a stud’s line falls when its neighbours are tightened.';

  return {
    title: 'Loads through the run',
    fit,
    description,
    options: basePlotOptions({
      height: 360,
      marginTop: 40,
      marginRight: 36,
      x: { label: 'Step', domain: [0.5, lastStep + 0.5], tickFormat: 'd', labelArrow: 'none', labelAnchor: 'center' },
      y: { label: `Stud load (${unit})`, grid: true, labelArrow: 'none', domain: [0, yMax] },
      marks: [...marks, ...labelMarks({ width: 640, height: 360, marginTop: 40, marginRight: 36, marginLeft: 64, marginBottom: 44, x: { domain: [0.5, lastStep + 0.5] }, y: { domain: [0, yMax] } }, { width: 640, fontPx: 13 }, passLabels, endLabels)],
    }),
    legend: {
      kind: 'swatches',
      items: [
        { label: 'Stud tightened in this step', colour: THEME.accent, shape: 'dot' },
        { label: 'Each stud’s load (number at the line’s end)', colour: THEME.ink, shape: 'line' },
        { label: 'Target', colour: THEME.ink, shape: 'dashed-line' },
        { label: `Band ± ${percentText(bandPercent)}`, colour: THEME.on, shape: 'band' },
      ],
    },
    table: {
      columns: ['Step', 'Pass', 'Stud tightened', ...Array.from({ length: studCount }, (_, i) => `Stud ${i + 1} (${unit})`)],
      rows: steps.map((s) => [s.order, s.pass, s.position, ...s.loadsN.map((n) => numberText(toChartForce(n, units)))]),
    },
  };
}

/** The smallest 1, 2 or 5 × 10^k multiple (for about 8 ticks) at or above a positive value. */
export function niceCeil(value: number): number {
  if (!(value > 0)) return 1;
  const raw = value / 8;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= raw)!;
  return Math.ceil(value / step - 1e-9) * step;
}

/** Gap between stud numbers at the line ends (px): the line box of their 11 px font (about 1.3 em) plus 1. */
const STUD_LABEL_FONT = 11;
const STUD_LABEL_GAP = Math.ceil(STUD_LABEL_FONT * 1.3) + 1;

/**
 * The pass names in the top margin (shortened or in two rows when passes are narrow) and the stud
 * numbers at the line ends, dodged apart along y with a short leader to their line, for the drawn
 * size. Pixel positions come from the options' domains, size and margins (linear scales).
 */
function labelMarks(
  opts: Plot.PlotOptions,
  { width, fontPx }: { width: number; fontPx: number },
  passLabels: readonly { x: number; label: string }[],
  endLabels: readonly StudLoadPoint[],
): Plot.Markish[] {
  const [ml, mr, mt, mb] = [opts.marginLeft ?? 0, opts.marginRight ?? 0, opts.marginTop ?? 0, opts.marginBottom ?? 0];
  const height = opts.height ?? 360;
  const [x0, x1] = ((opts.x as { domain?: number[] } | undefined)?.domain ?? [0, 1]) as [number, number];
  const [y0, y1] = ((opts.y as { domain?: number[] } | undefined)?.domain ?? [0, 1]) as [number, number];
  const xPx = (x: number) => ml + ((x - x0) / (x1 - x0)) * (width - ml - mr);
  const yPx = (y: number) => height - mb - ((y - y0) / (y1 - y0)) * (height - mt - mb);
  const yData = (px: number) => y0 + ((height - mb - px) / (height - mt - mb)) * (y1 - y0);

  // The y-axis label sits at the top left of the upper row's band: that row starts after it.
  const yLabel = String((opts.y as { label?: string } | undefined)?.label ?? '');
  const placed = layoutRowLabels(
    passLabels.map((p) => ({ start: xPx(p.x) + 4, variants: passLabelVariants(p.label) })),
    fontPx,
    width,
    6,
    [-Infinity, textWidth(yLabel, fontPx) + 8],
  );
  const rows = passLabels.map((p, i) => ({ x: p.x, label: p.label, text: placed[i]!.text, row: placed[i]!.row }));
  const rowMark = (row: number) =>
    Plot.text(rows.filter((r) => r.row === row), {
      x: 'x',
      text: 'text',
      frameAnchor: 'top',
      textAnchor: 'start',
      lineAnchor: 'bottom',
      dx: 4,
      dy: -4 - row * (fontPx + 2),
      fill: THEME.muted,
      ariaDescription: 'pass labels',
    });

  // Stud numbers: dodged along y (px) within the frame, in as many columns as they need.
  const top = mt + STUD_LABEL_GAP / 2;
  const bottom = height - mb - STUD_LABEL_GAP / 2;
  const perColumn = Math.max(1, Math.floor((bottom - top) / STUD_LABEL_GAP) + 1);
  const columns = Math.ceil(endLabels.length / perColumn);
  const sorted = [...endLabels].sort((a, b) => b.load - a.load);
  const stepPx = (width - ml - mr) / Math.max(1e-9, x1 - x0);
  const numbers = sorted.flatMap((_, column) => {
    const inColumn = sorted.filter((__, i) => i % columns === column);
    if (column >= columns || inColumn.length === 0) return [];
    const ys = dodge(inColumn.map((p) => yPx(p.load)), STUD_LABEL_GAP, top, bottom);
    const leader = (10 + column * (textWidth('00', STUD_LABEL_FONT) + 6)) / stepPx;
    // At the run's end the numbers sit just past the line ends; in a replay the lines go on
    // (dimmed), so the numbers move to the right edge, at the height of each stud's load now.
    const from = (p: StudLoadPoint) => (p.step >= x1 - 0.5 ? p.step : x1);
    return inColumn.map((p, i) => ({ ...p, fromX: from(p), fromY: from(p) === p.step ? p.load : yData(ys[i]!), labelX: from(p) + leader, labelY: yData(ys[i]!) }));
  });
  return [
    rowMark(0),
    rowMark(1),
    Plot.link(numbers, { x1: 'fromX', y1: 'fromY', x2: 'labelX', y2: 'labelY', stroke: THEME.muted, strokeWidth: 0.75, ariaDescription: 'stud number leaders' }),
    Plot.text(numbers, {
      x: 'labelX',
      y: 'labelY',
      text: (d: StudLoadPoint) => String(d.position),
      dx: 2,
      textAnchor: 'start',
      fill: THEME.muted,
      fontSize: STUD_LABEL_FONT,
      ariaDescription: 'stud numbers',
    }),
  ];
}

/** "Pass 2 (60 %)" → ["Pass 2 (60 %)", "Pass 2", "P2"]. */
function passLabelVariants(label: string): string[] {
  const short = label.replace(/\s*\(.*\)$/, '');
  return [...new Set([label, short, short.replace(/^Pass\s+/, 'P')])];
}
