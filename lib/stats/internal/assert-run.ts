import type { NormalisedRun } from '../../record/run-types';
import { StatsError } from '../stats-error';
import { describeNumber } from './describe-number';

/**
 * Validates a normalised run for analysis: integer studCount ≥ 2, a positive finite target, at
 * least one step, steps in increasing order with non-decreasing pass numbers, each position in
 * 1..studCount, and loadsN of length studCount holding finite numbers.
 *
 * References: lib/record/run-types.ts (the normalised run shape); house style, STYLE.md.
 * @throws {StatsError} `<fn> requires a run with at least one step`,
 *   `<fn> requires finite loads (got NaN at step 3, position 2)`, and similar.
 * @example
 * assertRun('finalLoads', run); // passes for a well-formed run
 */
export function assertRun(fn: string, run: NormalisedRun): void {
  if (!run || typeof run !== 'object') throw new StatsError(`${fn} requires a run`);
  const n = run.studCount;
  if (!Number.isInteger(n) || n < 2) throw new StatsError(`${fn} requires a studCount of at least 2 (got ${describeNumber(n)})`);
  if (!(Number.isFinite(run.targetLoadN) && run.targetLoadN > 0)) {
    throw new StatsError(`${fn} requires a positive targetLoadN (got ${describeNumber(run.targetLoadN)})`);
  }
  if (!Array.isArray(run.steps) || run.steps.length === 0) throw new StatsError(`${fn} requires a run with at least one step`);
  let previousOrder = Number.NEGATIVE_INFINITY;
  let previousPass = Number.NEGATIVE_INFINITY;
  run.steps.forEach((step, s) => {
    const label = `step ${s + 1}`;
    if (!(step.order > previousOrder)) throw new StatsError(`${fn} requires steps in increasing order (${label} has order ${describeNumber(step.order)})`);
    if (!Number.isInteger(step.pass) || step.pass < 1 || step.pass < previousPass) {
      throw new StatsError(`${fn} requires non-decreasing pass numbers from 1 (${label} has pass ${describeNumber(step.pass)})`);
    }
    if (!Number.isInteger(step.position) || step.position < 1 || step.position > n) {
      throw new StatsError(`${fn} requires positions from 1 to ${n} (${label} has position ${describeNumber(step.position)})`);
    }
    if (!Array.isArray(step.loadsN) || step.loadsN.length !== n) {
      throw new StatsError(`${fn} requires ${n} loads per step (${label} has ${Array.isArray(step.loadsN) ? step.loadsN.length : 0})`);
    }
    step.loadsN.forEach((v, i) => {
      if (typeof v !== 'number' || !Number.isFinite(v)) {
        throw new StatsError(`${fn} requires finite loads (got ${describeNumber(v)} at ${label}, position ${i + 1})`);
      }
    });
    previousOrder = step.order;
    previousPass = step.pass;
  });
}
