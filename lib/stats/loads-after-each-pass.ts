import type { NormalisedRun } from '../record/run-types';
import { assertRun } from './internal/assert-run';

/** One pass snapshot in {@link loadsAfterEachPass}. */
export interface PassSnapshot {
  pass: number;
  /** `order` of the pass's last step. */
  lastStepOrder: number;
  /** Every stud's load after that step, in N, index 0 = position 1. */
  loadsN: number[];
}

/**
 * Loads after each pass: for every pass, in order, the snapshot after its last step.
 *
 * Algorithm: one scan of the steps (passes are non-decreasing, validated).
 *
 * References: lib/record/run-types.ts; docs/REFERENCE.md §4 (multi-pass practice) and §9 (CV and
 * (max − min)/mean per pass, common practice).
 *
 * @throws {StatsError} any malformed run (see assertRun).
 * @example
 * // run = the hand-worked two-pass 4-stud run in tests/stats/support/four-stud-runs.ts
 * loadsAfterEachPass(run).map((p) => p.loadsN[0]); // [75, 82.5]
 */
export function loadsAfterEachPass(run: NormalisedRun): PassSnapshot[] {
  assertRun('loadsAfterEachPass', run);
  const out: PassSnapshot[] = [];
  run.steps.forEach((step, i) => {
    const next = run.steps[i + 1];
    if (!next || next.pass !== step.pass) out.push({ pass: step.pass, lastStepOrder: step.order, loadsN: [...step.loadsN] });
  });
  return out;
}
