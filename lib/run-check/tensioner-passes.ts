import { stepPositions, tensionerStepGroups, toolCoverageOf, type TensionerCoverage } from '../calc/tensioner-coverage';
import type { NormalisedRun } from '../record/run-types';

/**
 * How the steps of a run with tensioner steps that cover several studs split into passes: per pass
 * the steps and the positions they covered. A pass of such a run is one step with 100 % tool
 * coverage, two with 50 % (odd positions, then even ones: lib/calc/tensioner-coverage.ts) or one
 * step per stud with a single tool (common practice); which one is the method's
 * `tensionerCoverage`.
 */
export interface TensionerPass {
  pass: number;
  groups: number[][];
}

/** True when some step of the run tightened several studs at once. */
export const hasMultiStudSteps = (run: Pick<NormalisedRun, 'steps'>): boolean => run.steps.some((step) => stepPositions(step).length > 1);

export function tensionerPasses(run: Pick<NormalisedRun, 'steps'>): TensionerPass[] {
  const byPass = new Map<number, number[][]>();
  for (const step of [...run.steps].sort((a, b) => a.order - b.order)) {
    const groups = byPass.get(step.pass) ?? [];
    groups.push([...stepPositions(step)].sort((a, b) => a - b));
    byPass.set(step.pass, groups);
  }
  return [...byPass.entries()].sort((a, b) => a[0] - b[0]).map(([pass, groups]) => ({ pass, groups }));
}


/**
 * Why a pass of a tensioner run is not a whole pass, or null when it is: every stud covered exactly
 * once, in the groups of the method's coverage: one step of every stud (100 %), the odd and the even
 * positions (50 %), or one stud per step (one tool moved stud by stud).
 */
export function tensionerPassProblem(pass: TensionerPass, studCount: number, methodCoverage: TensionerCoverage | undefined): string | null {
  const covered = pass.groups.flat();
  const missing = Array.from({ length: studCount }, (_, i) => i + 1).filter((p) => !covered.includes(p));
  if (missing.length > 0 || covered.length !== studCount) {
    return `pass ${pass.pass} covers ${covered.length} stud positions${missing.length ? `, missing ${missing.join(', ')}` : ', some twice'}`;
  }
  const coverage = toolCoverageOf(methodCoverage);
  if (coverage === null) {
    const several = pass.groups.find((g) => g.length > 1);
    return several ? `pass ${pass.pass} pulls studs ${several.join(', ')} in one step; the method's tool is moved stud by stud (one stud per step)` : null;
  }
  const expected = tensionerStepGroups(studCount, coverage).map((g) => g.join(','));
  const found = pass.groups.map((g) => g.join(','));
  if (found.length !== expected.length || !found.every((g) => expected.includes(g))) {
    return `pass ${pass.pass} pulls studs ${pass.groups.map((g) => g.join(', ')).join(' then ')}; with ${coverage} % tensioner coverage a pass is ${coverage === 100 ? 'one step of every stud' : 'two steps, the odd then the even positions'}`;
  }
  return null;
}

/** True when the method's tool set pulls several studs at once, so its runs are held to groups. */
export const methodPullsGroups = (method: { tensionerCoverage?: TensionerCoverage }): boolean => toolCoverageOf(method.tensionerCoverage) !== null;
