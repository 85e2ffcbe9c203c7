import { sum } from 'simple-statistics';
import type { NormalisedRun } from '../record/run-types';
import { assertRun } from './internal/assert-run';

/** One pass in {@link lossPerPass}. */
export interface PassLoss {
  pass: number;
  /** Positions tightened in this pass, in the order of their last tightening in the pass. */
  positions: number[];
  /** Mean over those studs of (load at end of pass − load right after the stud's last tightening in the pass), N. */
  meanChangeN: number;
  /** Mean over those studs of the same change in % of the load right after tightening (studs at 0 N left out); null if none. */
  meanChangePercent: number | null;
}

/**
 * Load lost within each pass: for the studs tightened in the pass, the mean change from right
 * after (their last) tightening to the end of that pass, in N and in %. Negative = lost load.
 *
 * Algorithm: per pass, find each stud's last tightening step in the pass and compare with the
 * pass's last snapshot; compensated means.
 *
 * References: docs/REFERENCE.md §4 (elastic interaction; multi-pass practice); lib/record/run-types.ts.
 *
 * @throws {StatsError} any malformed run (see assertRun).
 * @example
 * // run = the hand-worked two-pass 4-stud run in tests/stats/support/four-stud-runs.ts
 * lossPerPass(run)[0]; // { pass: 1, positions: [1, 3, 2, 4], meanChangeN: -12.5, meanChangePercent: -13.0757 (hand) }
 */
export function lossPerPass(run: NormalisedRun): PassLoss[] {
  assertRun('lossPerPass', run);
  const out: PassLoss[] = [];
  let start = 0;
  while (start < run.steps.length) {
    const pass = run.steps[start]!.pass;
    let end = start;
    while (end + 1 < run.steps.length && run.steps[end + 1]!.pass === pass) end++;
    const endLoads = run.steps[end]!.loadsN;
    const lastInPass = new Map<number, number>();
    for (let s = start; s <= end; s++) {
      const p = run.steps[s]!.position;
      lastInPass.delete(p);
      lastInPass.set(p, s);
    }
    const changes: number[] = [];
    const percents: number[] = [];
    for (const [position, s] of lastInPass) {
      const after = run.steps[s]!.loadsN[position - 1]!;
      const change = endLoads[position - 1]! - after;
      changes.push(change);
      if (after !== 0) percents.push((change / after) * 100);
    }
    out.push({
      pass,
      positions: [...lastInPass.keys()],
      meanChangeN: sum(changes) / changes.length,
      meanChangePercent: percents.length === 0 ? null : sum(percents) / percents.length,
    });
    start = end + 1;
  }
  return out;
}
