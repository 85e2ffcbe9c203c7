import { planSteps } from '../record/step-plan';
import type { RunCheckInput, RunCheckReason } from './types';

/**
 * Stud count: the run has one load per stud of its joint, and the method has a stud order for
 * that many studs (otherwise its steps cannot be held against the method).
 */
export function checkStudCount({ run, jointStudCount, method }: RunCheckInput): RunCheckReason | null {
  if (run.studCount !== jointStudCount) {
    return { rule: 'stud_count', message: `The run has loads for ${run.studCount} studs, but its joint has ${jointStudCount}.` };
  }
  const plan = planSteps(method, jointStudCount);
  if (plan.problem) return { rule: 'stud_count', message: `The method "${method.name}" has no stud order for ${jointStudCount} studs, so the steps cannot be checked against it.` };
  return null;
}
