import { planSteps } from '../record/step-plan';
import type { RunCheckInput, RunCheckReason } from './types';
import { hasMultiStudSteps, methodPullsGroups } from './tensioner-passes';

/**
 * Order: step by step, the stud tightened is the one the method's order prescribes (check passes
 * go round the studs in turn, as the hand-entry grid plans them). Reports the first difference.
 * A method without a stud order for the joint's stud count prescribes no order, so nothing is held.
 */
export function checkStepOrder({ run, jointStudCount, method }: RunCheckInput): RunCheckReason | null {
  // A run of tensioner steps that cover several studs (or of a method that pulls groups) is held to its groups by checkPasses instead.
  if (hasMultiStudSteps(run) || methodPullsGroups(method)) return null;
  const plan = planSteps(method, jointStudCount);
  if (plan.problem) return null;
  const steps = [...run.steps].sort((a, b) => a.order - b.order);
  const length = Math.min(steps.length, plan.steps.length);
  for (let i = 0; i < length; i += 1) {
    const recorded = steps[i]!;
    const planned = plan.steps[i]!;
    if (recorded.position !== planned.position) {
      return {
        rule: 'step_order',
        message: `Step ${i + 1} tightened stud ${recorded.position}; the method "${method.name}" prescribes stud ${planned.position} there (pass ${planned.pass}${planned.check ? ', a check pass' : ''}).`,
      };
    }
  }
  return null;
}
