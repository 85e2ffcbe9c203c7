import type { RunCheckInput, RunCheckReason } from './types';

/**
 * Stud count: the run has one load per stud of its joint. A method without a stud order for that
 * many studs is not a fault of the run: its passes and steps are still counted (`checkPasses`),
 * only the order step by step cannot be held against it (`checkStepOrder` then says nothing).
 */
export function checkStudCount({ run, jointStudCount }: RunCheckInput): RunCheckReason | null {
  if (run.studCount !== jointStudCount) {
    return { rule: 'stud_count', message: `The run has loads for ${run.studCount} studs, but its joint has ${jointStudCount}.` };
  }
  return null;
}
