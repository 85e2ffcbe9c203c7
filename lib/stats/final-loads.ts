import type { NormalisedRun } from '../record/run-types';
import { assertRun } from './internal/assert-run';

/**
 * Final loads of a run: every stud's load after the last step, in N, index 0 = position 1.
 *
 * Algorithm: a copy of the last step's snapshot.
 *
 * References: lib/record/run-types.ts (normalised run); docs/REFERENCE.md §9 (per-stud load reporting, common practice).
 *
 * @throws {StatsError} `finalLoads requires a run with at least one step`, or any malformed run (see assertRun).
 * @example
 * // run = the hand-worked two-pass 4-stud run in tests/stats/support/four-stud-runs.ts
 * finalLoads(run); // [82.5, 82.5, 82.5, 82.5]
 */
export function finalLoads(run: NormalisedRun): number[] {
  assertRun('finalLoads', run);
  return [...run.steps[run.steps.length - 1]!.loadsN];
}
