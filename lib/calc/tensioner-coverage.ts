import { AppError } from '@/lib/http/errors';

/**
 * The step model of a hydraulic tensioner that tightens several studs at once: with 100 % tool
 * coverage one step takes every stud; with 50 % coverage (a tool on every other stud) a pass is two
 * steps, the odd positions then the even ones (common practice). Kept here so the simulator, the
 * classroom and the run report can share one model; not yet wired into them.
 *
 * Per stud a step has an applied load (the tool's load while pressurised) and a residual load (after
 * the nut takes it and the pressure is released). The measured load transfer factor is
 * applied / residual, the same ratio as the calculator's rule, applied = residual × LTF
 * (docs/REFERENCE.md §4, lib/calc/tensioner.ts).
 */

export type ToolCoverage = 100 | 50;

/** Position groups (1-based) tightened together, in order, for one pass. */
export function tensionerStepGroups(studCount: number, coverage: ToolCoverage): number[][] {
  if (!Number.isInteger(studCount) || studCount < 2) throw new AppError('invalid_input', 'A tensioned joint needs at least two studs.', { field: 'studCount' });
  const all = Array.from({ length: studCount }, (_, i) => i + 1);
  if (coverage === 100) return [all];
  if (studCount % 2 !== 0) throw new AppError('invalid_input', '50 % tool coverage needs an even number of studs.', { field: 'coverage' });
  return [all.filter((p) => p % 2 === 1), all.filter((p) => p % 2 === 0)];
}

/** Measured load transfer factor per stud: applied / residual; null where the residual load is not above zero. */
export function measuredLoadTransferFactors(appliedN: readonly number[], residualN: readonly number[]): (number | null)[] {
  if (appliedN.length !== residualN.length) throw new AppError('invalid_input', 'Every stud needs both an applied and a residual load.', { field: 'loads' });
  return appliedN.map((applied, i) => {
    const residual = residualN[i]!;
    return Number.isFinite(applied) && Number.isFinite(residual) && residual > 0 ? applied / residual : null;
  });
}
