import type { NormalisedRun } from '../record/run-types';
import { assertNumber } from './internal/assert-number';
import { assertRun } from './internal/assert-run';
import { StatsError } from './stats-error';
import { coefficientOfVariation } from './coefficient-of-variation';
import { finalLoads } from './final-loads';
import { largestDeviationFromTarget } from './largest-deviation-from-target';
import { mean } from './mean';
import { processCapability } from './process-capability';
import { rangeOverMean } from './range-over-mean';
import { sampleStandardDeviation } from './sample-standard-deviation';
import { shareWithinBand } from './share-within-band';

/** Result of {@link summariseRun}. */
export interface RunSummary {
  studCount: number;
  targetLoadN: number;
  bandPercent: number;
  meanN: number;
  sdN: number;
  /** s/x̄ as a ratio. */
  cv: number;
  /** (max − min)/mean as a ratio. */
  rangeOverMean: number;
  /** Signed deviation of the stud farthest from target, in % of target. */
  largestDeviationFromTargetPercent: number;
  /** Position (1-based) of that stud. */
  largestDeviationPosition: number;
  /** Share (0..1) of studs within target ± band %. */
  shareWithinBand: number;
  cp: number | null;
  cpk: number | null;
}

/**
 * One-look summary of a run's final loads: mean, SD, CV, (max − min)/mean, the largest deviation
 * from target in %, the share of studs within target ± band %, and Cp/Cpk against that band.
 *
 * Algorithm: the layer's own functions on `finalLoads(run)` (refined mean, corrected two-pass SD).
 *
 * References: docs/REFERENCE.md §9 (CV, (max − min)/mean, % of target per stud, common practice);
 * NIST/SEMATECH e-Handbook §6.1.6 (Cp, Cpk).
 *
 * @throws {StatsError} any malformed run (see assertRun), `summariseRun requires a positive bandPercent (got 0)`,
 *   `summariseRun requires final loads with a positive mean`.
 * @example
 * summariseRun(run, { bandPercent: 5 }).cv; // 0.015179325095609217 for final loads [98, 101.5, 99, 100.2] kN (numpy std(ddof=1)/mean)
 */
export function summariseRun(run: NormalisedRun, options: { bandPercent: number }): RunSummary {
  assertRun('summariseRun', run);
  assertNumber('summariseRun', 'bandPercent', options.bandPercent, 'positive');
  const loads = finalLoads(run);
  const m = mean(loads);
  if (!(m > 0)) throw new StatsError('summariseRun requires final loads with a positive mean');
  const deviation = largestDeviationFromTarget(loads, run.targetLoadN);
  const capability = processCapability(loads, { target: run.targetLoadN, bandPercent: options.bandPercent });
  return {
    studCount: run.studCount,
    targetLoadN: run.targetLoadN,
    bandPercent: options.bandPercent,
    meanN: m,
    sdN: sampleStandardDeviation(loads),
    cv: coefficientOfVariation(loads),
    rangeOverMean: rangeOverMean(loads),
    largestDeviationFromTargetPercent: deviation.percent,
    largestDeviationPosition: deviation.index + 1,
    shareWithinBand: shareWithinBand(loads, run.targetLoadN, options.bandPercent).share,
    cp: capability.cp,
    cpk: capability.cpk,
  };
}
