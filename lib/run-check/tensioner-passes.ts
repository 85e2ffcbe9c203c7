import { stepPositions, tensionerStepGroups, type ToolCoverage } from '../calc/tensioner-coverage';
import type { NormalisedRun } from '../record/run-types';

/**
 * How the steps of a run with tensioner steps that cover several studs split into passes: per pass
 * the steps and the positions they covered. A pass of such a run is one step with 100 % tool
 * coverage, two with 50 % (odd positions, then even ones: lib/calc/tensioner-coverage.ts) or one
 * step per stud with a single tool (common practice).
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

/** The tool coverage a pass's step count stands for, or null when it is neither 1 nor 2 steps. */
export const coverageOfPass = (stepCount: number): ToolCoverage | null => (stepCount === 1 ? 100 : stepCount === 2 ? 50 : null);

/**
 * Why a pass of a tensioner run is not a whole pass, or null when it is: every stud covered exactly
 * once, by one step (100 %), the odd and the even positions (50 %), or one stud per step.
 */
export function tensionerPassProblem(pass: TensionerPass, studCount: number): string | null {
  const covered = pass.groups.flat();
  const missing = Array.from({ length: studCount }, (_, i) => i + 1).filter((p) => !covered.includes(p));
  if (missing.length > 0 || covered.length !== studCount) {
    return `pass ${pass.pass} covers ${covered.length} stud positions${missing.length ? `, missing ${missing.join(', ')}` : ', some twice'}`;
  }
  if (pass.groups.every((g) => g.length === 1)) return null;
  const coverage = coverageOfPass(pass.groups.length);
  if (coverage === null || (coverage === 50 && studCount % 2 !== 0)) return `pass ${pass.pass} has ${pass.groups.length} steps; a tensioner pass has 1 (100 % tool coverage), 2 (50 %) or one per stud`;
  const expected = tensionerStepGroups(studCount, coverage).map((g) => g.join(','));
  const found = pass.groups.map((g) => g.join(','));
  if (!found.every((g) => expected.includes(g))) return `pass ${pass.pass} pulls studs ${pass.groups.map((g) => g.join(', ')).join(' then ')}; with ${coverage} % tool coverage a step takes ${coverage === 100 ? 'every stud' : 'the odd or the even positions'}`;
  return null;
}
