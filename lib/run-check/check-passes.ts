import { count } from './format';
import { hasMultiStudSteps, methodPullsGroups, tensionerPassProblem, tensionerPasses } from './tensioner-passes';
import type { RunCheckInput, RunCheckReason } from './types';

/**
 * Passes and steps: the run has as many passes and steps as its method prescribes for the joint's
 * stud count (each pass tightens every stud once; check passes included). A run with 4 passes of
 * 8 studs stored as "one pass, cross order" contradicts its method. Counted from the method's
 * passes, so a method without a stud order for this stud count is still held to its passes.
 */
export function checkPasses({ run, jointStudCount, method }: RunCheckInput): RunCheckReason | null {
  const plannedPasses = method.passes.length + method.checkPasses;
  if (hasMultiStudSteps(run) || methodPullsGroups(method)) return checkTensionerPasses(run, jointStudCount, method, plannedPasses);
  const plannedSteps = plannedPasses * jointStudCount;
  const recordedPasses = new Set(run.steps.map((step) => step.pass)).size;
  if (recordedPasses === plannedPasses && run.steps.length === plannedSteps) return null;
  return {
    rule: 'passes',
    message:
      `The run has ${count(recordedPasses, 'pass', 'passes')} and ${count(run.steps.length, 'step', 'steps')}; ` +
      `the method "${method.name}" prescribes ${count(plannedPasses, 'pass', 'passes')} and ${count(plannedSteps, 'step', 'steps')} for ${jointStudCount} studs.`,
  };
}

/**
 * A run whose tensioner steps cover several studs, or of a method whose tool set pulls several at
 * once: as many passes as the method prescribes, each covering every stud once in the groups of the
 * method's coverage: 1 step (100 % tensioner coverage), 2 (50 %) or one per stud (one tool).
 */
function checkTensionerPasses(run: RunCheckInput['run'], studCount: number, method: RunCheckInput['method'], plannedPasses: number): RunCheckReason | null {
  const passes = tensionerPasses(run);
  const problems = passes.map((pass) => tensionerPassProblem(pass, studCount, method.tensionerCoverage)).filter((p): p is string => p !== null);
  if (passes.length === plannedPasses && problems.length === 0) return null;
  const counted = `The run has ${count(passes.length, 'pass', 'passes')} of tensioner steps; the method "${method.name}" prescribes ${count(plannedPasses, 'pass', 'passes')}`;
  return { rule: 'passes', message: problems.length ? `${counted}, and ${problems[0]}.` : `${counted}.` };
}
