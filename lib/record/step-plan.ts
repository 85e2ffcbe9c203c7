/**
 * The rows of the hand-entry grid: one row per step, in the order the method tightens the studs.
 * Browser-safe. Each pass's order is the method's `orderByStudCount[String(studCount)]`; check
 * passes follow as circular passes 1..N at 100 % of target (a check pass goes round the studs in
 * turn: common practice). A tensioner method whose tool set pulls several studs at once
 * (`tensionerCoverage`, lib/calc/tensioner-coverage.ts) has one row per group instead: every stud
 * (100 %) or the odd then the even positions (50 %), check passes included.
 */
import { passGroups, type TensionerCoverage } from '@/lib/calc/tensioner-coverage';
import type { MethodPass } from '@/models/method';

export interface PlannedStep {
  /** 1-based step order. */
  order: number;
  pass: number;
  /** Position of the stud tightened in this step (the first of `positions`). */
  position: number;
  /** Every stud the step tightens: one, or a tensioner group. */
  positions: number[];
  percentOfTarget: number;
  /** The pass is a check pass (circular, at full target). */
  check: boolean;
}

export interface StepPlan {
  steps: PlannedStep[];
  /** Why there is no plan (e.g. no order for this stud count), when `steps` is empty. */
  problem: string | null;
}

export interface PlannableMethod {
  name: string;
  passes: readonly MethodPass[];
  checkPasses: number;
  /** Absent or `one_stud`: one stud per step. */
  tensionerCoverage?: TensionerCoverage;
}

export function planSteps(method: PlannableMethod, studCount: number): StepPlan {
  const steps: PlannedStep[] = [];
  const add = (pass: number, groups: number[][], percentOfTarget: number, check: boolean) => {
    for (const positions of groups) steps.push({ order: steps.length + 1, pass, position: positions[0]!, positions, percentOfTarget, check });
  };
  let pass = 0;
  for (const [i, p] of method.passes.entries()) {
    const order = p.orderByStudCount[String(studCount)];
    if (!order || order.length !== studCount) {
      return { steps: [], problem: `The method "${method.name}" has no order for ${studCount} studs in pass ${i + 1}. Add one on the Joints page, or choose another method.` };
    }
    const groups = coverageGroups(method, order, studCount);
    if (typeof groups === 'string') return { steps: [], problem: groups };
    add(++pass, groups, p.percentOfTarget, false);
  }
  const circular = Array.from({ length: studCount }, (_, i) => i + 1);
  for (let c = 0; c < method.checkPasses; c++) {
    const groups = coverageGroups(method, circular, studCount);
    if (typeof groups === 'string') return { steps: [], problem: groups };
    add(++pass, groups, 100, true);
  }
  return { steps, problem: steps.length ? null : `The method "${method.name}" has no passes.` };
}

/** A pass's groups, or why the method's coverage cannot be used on this joint (50 % on an odd stud count). */
function coverageGroups(method: PlannableMethod, order: readonly number[], studCount: number): number[][] | string {
  if (method.tensionerCoverage === 'every_second_stud' && studCount % 2 !== 0) {
    return `The method "${method.name}" puts a tensioner on every second stud, which needs an even number of studs; this joint has ${studCount}. Choose another method.`;
  }
  return passGroups(order, studCount, method.tensionerCoverage);
}

/**
 * The steps a logger file is matched against (lib/ingest: markers, check passes after the last rise):
 * one stud per step only. A method whose tool set pulls several studs at once gives none; ingest
 * finds its groups from the loads, and the run check holds them to the method's coverage.
 */
export function importPlanSteps(method: PlannableMethod, studCount: number): PlannedStep[] | undefined {
  return method.tensionerCoverage === undefined || method.tensionerCoverage === 'one_stud' ? planSteps(method, studCount).steps : undefined;
}
