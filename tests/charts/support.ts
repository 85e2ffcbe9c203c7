import type { PlotOptions } from '@observablehq/plot';
import type { RunAnalysis } from '@/lib/analysis/types';

/** A mark of a builder's options found by its ariaLabel; fails the test if missing. */
export function markNamed(options: PlotOptions, ariaLabel: string) {
  const marks = (options.marks ?? []) as unknown as { ariaDescription?: string; data?: unknown; constructor: { name: string } }[];
  const mark = marks.find((m) => m.ariaDescription === ariaLabel);
  if (!mark) throw new Error(`no mark with ariaLabel "${ariaLabel}" (have: ${marks.map((m) => m.ariaDescription).join(', ')})`);
  return mark as { ariaDescription: string; data: unknown[]; constructor: { name: string }; [key: string]: unknown };
}

export function markLabels(options: PlotOptions): string[] {
  return ((options.marks ?? []) as unknown as { ariaDescription?: string }[]).map((m) => m.ariaDescription ?? '');
}

/**
 * A small invented 4-stud run with two passes (30 %, 100 %), circular order 1-2-3-4 each pass.
 * Loads are hand-made for the tests (not from a rig); target 50 kN, band ± 10 %.
 */
export function smallRun(): RunAnalysis {
  const k = 1000;
  const steps = [
    [1, 1, [15 * k, 0, 0, 0]],
    [1, 2, [14 * k, 15 * k, 0, 0]],
    [1, 3, [14 * k, 14 * k, 15 * k, 0]],
    [1, 4, [13 * k, 14 * k, 14 * k, 15 * k]],
    [2, 1, [50 * k, 13 * k, 13 * k, 14 * k]],
    [2, 2, [47 * k, 50 * k, 13 * k, 13 * k]],
    [2, 3, [46 * k, 47 * k, 50 * k, 12 * k]],
    [2, 4, [44 * k, 46 * k, 47 * k, 51 * k]],
  ] as const;
  return {
    runId: 1,
    studCount: 4,
    targetLoadN: 50 * k,
    bandPercent: 10,
    finalLoadsN: [44 * k, 46 * k, 47 * k, 51 * k],
    steps: steps.map(([pass, position, loads], i) => ({
      order: i + 1,
      pass,
      position,
      loadsN: [...loads],
      timeS: null,
      appliedTorqueNm: null,
    })),
    passes: [
      { pass: 1, percentOfTarget: 30, loadsAfterN: [13 * k, 14 * k, 14 * k, 15 * k], meanLossPercent: -6.7, cv: 0.058 },
      { pass: 2, percentOfTarget: 100, loadsAfterN: [44 * k, 46 * k, 47 * k, 51 * k], meanLossPercent: -6.5, cv: 0.063 },
    ],
    drift: [
      { position: 1, afterLastTighteningN: 50 * k, finalN: 44 * k, driftPercent: -12 },
      { position: 2, afterLastTighteningN: 50 * k, finalN: 46 * k, driftPercent: -8 },
      { position: 3, afterLastTighteningN: 50 * k, finalN: 47 * k, driftPercent: -6 },
      { position: 4, afterLastTighteningN: 51 * k, finalN: 51 * k, driftPercent: 0 },
    ],
    reach: [
      { distance: 1, coefficient: -0.12, standardError: 0.02, observations: 16 },
      { distance: 2, coefficient: -0.04, standardError: 0.03, observations: 8 },
    ],
    figures: { meanN: 47 * k, sdN: 2.94 * k, cv: 0.0626, rangeOverMean: 0.149, largestDeviationPercent: 12, shareWithinBand: 0.75, cp: null, cpk: null },
  };
}
