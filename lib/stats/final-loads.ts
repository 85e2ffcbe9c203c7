import type { NormalisedRun } from '../run-types';
import { assertRun } from './internal/assert-run';

/**
 * Final loads of a run: every stud's load after the last step, in N, index 0 = position 1.
 *
 * Algorithm: a copy of the last step's snapshot.
 *
 * References: lib/run-types.ts (normalised run); REFERENCE.md §9 (per-stud load reporting, common practice).
 *
 * @throws {StatsError} `finalLoads requires a run with at least one step`, or any malformed run (see assertRun).
 * @example
 * finalLoads(run); // [98000, 101500, 99000, 100200] for a 4-stud run
 */
export function finalLoads(run: NormalisedRun): number[] {
  assertRun('finalLoads', run);
  return [...run.steps[run.steps.length - 1]!.loadsN];
}
