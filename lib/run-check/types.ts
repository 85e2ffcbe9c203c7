import type { NormalisedRun } from '../record/run-types';
import type { MethodPass, TensionerCoverage } from '@/models/method';

/**
 * The check a run passes before it counts (lib/run-check). Pure and browser-safe: the server calls
 * `checkRun` once, in lib/data/runs/store-run.ts, for every way a run comes in (upload, hand entry,
 * live stream when it is finished, simulate).
 */

export const RUN_CHECK_RULES = ['stud_count', 'passes', 'step_order', 'over_yield', 'off_band', 'flat_channel', 'time_gap', 'tool_past_due'] as const;
export type RunCheckRule = (typeof RUN_CHECK_RULES)[number];

/** One reason a run is held for review: the rule it failed and a sentence for the screen. */
export interface RunCheckReason {
  rule: RunCheckRule;
  message: string;
}

export interface RunCheckInput {
  run: NormalisedRun;
  /** The joint's stud count. */
  jointStudCount: number;
  /** `tensionerCoverage` absent = `one_stud` (one stud per step). */
  method: { name: string; passes: readonly MethodPass[]; checkPasses: number; tensionerCoverage?: TensionerCoverage };
  /** The run's band, ± % of target. */
  bandPercent: number;
  /** The stud's minimum yield load and the table it comes from; null when the grade is not in our table. */
  yieldLoad: { yieldLoadN: number; source: string } | null;
}

export type RunCheckRuleFn = (input: RunCheckInput) => RunCheckReason | null;
