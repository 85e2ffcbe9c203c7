/**
 * The rows of the hand-entry grid: one row per step, in the order the method tightens the studs.
 * Browser-safe. Each pass's order is the method's `orderByStudCount[String(studCount)]`; check
 * passes follow as circular passes 1..N at 100 % of target (a check pass goes round the studs in
 * turn: common practice).
 */
import type { MethodPass } from '@/models/method';

export interface PlannedStep {
  /** 1-based step order. */
  order: number;
  pass: number;
  /** Position of the stud tightened in this step. */
  position: number;
  percentOfTarget: number;
  /** The pass is a check pass (circular, at full target). */
  check: boolean;
}

export interface StepPlan {
  steps: PlannedStep[];
  /** Why there is no plan (e.g. no order for this stud count), when `steps` is empty. */
  problem: string | null;
}

export function planSteps(method: { name: string; passes: readonly MethodPass[]; checkPasses: number }, studCount: number): StepPlan {
  const steps: PlannedStep[] = [];
  let pass = 0;
  for (const [i, p] of method.passes.entries()) {
    const order = p.orderByStudCount[String(studCount)];
    if (!order || order.length !== studCount) {
      return { steps: [], problem: `The method "${method.name}" has no order for ${studCount} studs in pass ${i + 1}. Add one on the Joints page, or choose another method.` };
    }
    pass++;
    for (const position of order) steps.push({ order: steps.length + 1, pass, position, percentOfTarget: p.percentOfTarget, check: false });
  }
  for (let c = 0; c < method.checkPasses; c++) {
    pass++;
    for (let position = 1; position <= studCount; position++) steps.push({ order: steps.length + 1, pass, position, percentOfTarget: 100, check: true });
  }
  return { steps, problem: steps.length ? null : `The method "${method.name}" has no passes.` };
}
