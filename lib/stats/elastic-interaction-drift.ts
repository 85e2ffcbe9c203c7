import type { NormalisedRun } from '../record/run-types';
import { assertRun } from './internal/assert-run';

/** Drift of one stud in {@link elasticInteractionDrift}. */
export interface StudDrift {
  position: number;
  /** `order` of the step that last tightened this stud; null if the run never tightened it. */
  lastTightenedStepOrder: number | null;
  /** Load right after that step, in N. */
  loadAfterTighteningN: number | null;
  finalLoadN: number;
  /** final − right-after, in N; negative = the stud lost load to later tightening of others. */
  driftN: number | null;
  /** driftN in % of the load right after tightening; null if that load is 0 or the stud was never tightened. */
  driftPercent: number | null;
}

/**
 * Per-stud elastic-interaction drift: how much each stud's load changed between the moment it
 * was last tightened and the end of the run, as N and % of the load right after tightening.
 * Negative drift is load lost as later studs compress the joint under it.
 *
 * Algorithm: one scan for each stud's last tightening step; difference to the final snapshot.
 *
 * References: docs/REFERENCE.md §4 ("Elastic interaction": bolts tightened earlier lose preload);
 * lib/record/run-types.ts.
 *
 * @throws {StatsError} any malformed run (see assertRun).
 * @example
 * // run = the hand-worked one-pass 4-stud run in tests/stats/support/four-stud-runs.ts
 * elasticInteractionDrift(run)[0]; // { position: 1, lastTightenedStepOrder: 1, loadAfterTighteningN: 100, finalLoadN: 75, driftN: -25, driftPercent: -25 }
 */
export function elasticInteractionDrift(run: NormalisedRun): StudDrift[] {
  assertRun('elasticInteractionDrift', run);
  const last = new Array<number>(run.studCount).fill(-1);
  run.steps.forEach((step, s) => {
    last[step.position - 1] = s;
  });
  const final = run.steps[run.steps.length - 1]!.loadsN;
  return last.map((s, i) => {
    const finalLoadN = final[i]!;
    if (s < 0) {
      return { position: i + 1, lastTightenedStepOrder: null, loadAfterTighteningN: null, finalLoadN, driftN: null, driftPercent: null };
    }
    const step = run.steps[s]!;
    const after = step.loadsN[i]!;
    const driftN = finalLoadN - after;
    return {
      position: i + 1,
      lastTightenedStepOrder: step.order,
      loadAfterTighteningN: after,
      finalLoadN,
      driftN,
      driftPercent: after === 0 ? null : (driftN / after) * 100,
    };
  });
}
