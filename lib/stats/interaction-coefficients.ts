import { sum } from 'simple-statistics';
import type { NormalisedRun } from '../record/run-types';
import { StatsError } from './stats-error';
import { assertRun } from './internal/assert-run';
import { assertValues } from './internal/assert-values';

/** Reach at one neighbour distance in {@link interactionCoefficients}. */
export interface InteractionAtDistance {
  /** Circular distance k between the tightened stud and the affected stud (0 = the stud itself). */
  distance: number;
  /** c_k: change of a stud at distance k per unit change of the tightened stud (k = 0: 1 by definition). */
  coefficient: number;
  /** Standard error of c_k from the through-origin fit; 0 for k = 0; null with fewer than two observations. */
  standardError: number | null;
  /** Number of (step, stud) pairs used. */
  observations: number;
}

/** Result of {@link interactionCoefficients}. */
export interface InteractionCoefficientsResult {
  studCount: number;
  /** Steps whose change could be used (those with an earlier snapshot). */
  stepsUsed: number;
  byDistance: InteractionAtDistance[];
}

/**
 * Elastic-interaction coefficients by neighbour distance ("reach"): how much a stud's load moves
 * when a stud k positions away is tightened, per newton gained by the tightened stud.
 *
 * Model (our own, in the spirit of the elastic-interaction-coefficient methods): for each step s
 * on stud p and every other stud q, Δq = c_k·Δp with k the circular distance between p and q
 * (stud 1 and stud N are neighbours), k = 1..⌊N/2⌋. Each c_k is the least-squares slope through
 * the origin over all steps and studs at that distance: c_k = ΣΔpΔq/ΣΔp², with
 * SE = √(SSR/(m − 1)/ΣΔp²) over m observations. Deltas are between consecutive snapshots; the
 * first step has no earlier snapshot unless `initialLoadsN` (loads before the run, for example the
 * zeroed gauges) is given.
 *
 * References: docs/REFERENCE.md §4 ("Elastic interaction", [BSCI], [MDPI] elastic-interaction-coefficient
 * methods); least squares through the origin as in NIST StRD NoInt1/NoInt2.
 *
 * @throws {StatsError} any malformed run (see assertRun), `interactionCoefficients requires initialLoadsN with 4 values (got 3)`,
 *   `interactionCoefficients requires at least one step with an earlier snapshot`,
 *   `interactionCoefficients requires a step that changes the tightened stud's load`.
 * @example
 * // run = the hand-worked two-pass 4-stud run in tests/stats/support/four-stud-runs.ts (neighbours −0.1Δ, opposite −0.05Δ)
 * interactionCoefficients(run, { initialLoadsN: [0, 0, 0, 0] }).byDistance[1]; // { distance: 1, coefficient: -0.1 (to 1e-15), standardError: ≈0, observations: 16 }
 */
export function interactionCoefficients(
  run: NormalisedRun,
  options: { initialLoadsN?: readonly number[] } = {},
): InteractionCoefficientsResult {
  assertRun('interactionCoefficients', run);
  const n = run.studCount;
  const snapshots: (readonly number[])[] = [];
  if (options.initialLoadsN !== undefined) {
    assertValues('interactionCoefficients', options.initialLoadsN, 1, 'of initialLoadsN');
    if (options.initialLoadsN.length !== n) {
      throw new StatsError(`interactionCoefficients requires initialLoadsN with ${n} values (got ${options.initialLoadsN.length})`);
    }
    snapshots.push(options.initialLoadsN);
  }
  const firstUsable = snapshots.length === 0 ? 1 : 0;
  run.steps.forEach((s) => snapshots.push(s.loadsN));
  const stepsUsed = run.steps.length - firstUsable;
  if (stepsUsed < 1) throw new StatsError('interactionCoefficients requires at least one step with an earlier snapshot');
  const maxK = Math.floor(n / 2);
  const xs: number[][] = Array.from({ length: maxK + 1 }, () => []);
  const ys: number[][] = Array.from({ length: maxK + 1 }, () => []);
  let anyChange = false;
  for (let s = firstUsable; s < run.steps.length; s++) {
    const step = run.steps[s]!;
    // snapshots[offset + s] is the snapshot after step s; the one before it is at offset + s − 1.
    const offset = 1 - firstUsable;
    const before = snapshots[offset + s - 1]!;
    const after = snapshots[offset + s]!;
    const p = step.position - 1;
    const dp = after[p]! - before[p]!;
    if (dp !== 0) anyChange = true;
    for (let q = 0; q < n; q++) {
      if (q === p) continue;
      const d = Math.abs(q - p);
      const k = Math.min(d, n - d);
      xs[k]!.push(dp);
      ys[k]!.push(after[q]! - before[q]!);
    }
  }
  if (!anyChange) throw new StatsError("interactionCoefficients requires a step that changes the tightened stud's load");
  const byDistance: InteractionAtDistance[] = [{ distance: 0, coefficient: 1, standardError: 0, observations: stepsUsed }];
  for (let k = 1; k <= maxK; k++) {
    const x = xs[k]!;
    const y = ys[k]!;
    const sxx = sum(x.map((v) => v * v));
    const sxy = sum(x.map((v, i) => v * y[i]!));
    const coefficient = sxy / sxx;
    const m = x.length;
    const ssr = sum(y.map((v, i) => (v - coefficient * x[i]!) ** 2));
    byDistance.push({
      distance: k,
      coefficient,
      standardError: m < 2 ? null : Math.sqrt(ssr / (m - 1) / sxx),
      observations: m,
    });
  }
  return { studCount: n, stepsUsed, byDistance };
}
