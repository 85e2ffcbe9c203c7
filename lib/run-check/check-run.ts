import { checkBand } from './check-band';
import { checkFlatChannel } from './check-flat-channel';
import { checkPasses } from './check-passes';
import { checkStepOrder } from './check-step-order';
import { checkStudCount } from './check-stud-count';
import { checkTimeGaps } from './check-time-gaps';
import { checkYield } from './check-yield';
import type { RunCheckInput, RunCheckReason, RunCheckRuleFn } from './types';

/** Every rule, in the order its reason is shown. */
export const RUN_CHECK_RULE_FNS: readonly RunCheckRuleFn[] = [checkStudCount, checkPasses, checkStepOrder, checkYield, checkBand, checkFlatChannel, checkTimeGaps];

/**
 * Checks a run before it counts. An empty list means the run may be stored as complete; otherwise
 * it is stored as "needs review" with these reasons. The figures are computed either way.
 */
export function checkRun(input: RunCheckInput): RunCheckReason[] {
  return RUN_CHECK_RULE_FNS.map((rule) => rule(input)).filter((reason): reason is RunCheckReason => reason !== null);
}

/** True when a reason says the loads went above the stud's yield load (the report then shows a caution). */
export const isOverYield = (reasons: readonly RunCheckReason[]): boolean => reasons.some((reason) => reason.rule === 'over_yield');
