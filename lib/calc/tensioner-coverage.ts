import { AppError } from '@/lib/http/errors';
import type { NormalisedRun, NormalisedStep } from '@/lib/record/run-types';
import type { TensionerCoverage as StoredCoverage } from '@/models/method';
import { LTF_RULES, loadTransferFactor } from './tensioner';

/**
 * The step model of a hydraulic tensioner that tightens several studs at once: with 100 % tool
 * coverage one step takes every stud; with 50 % coverage (a tool on every other stud) a pass is two
 * steps, the odd positions then the even ones (common practice). Kept here so the simulator, the
 * classroom and the run report share one model (`NormalisedStep.covers`, lib/record/run-types.ts).
 *
 * Per stud a step has an applied load (the tool's load while pressurised) and a residual load (after
 * the nut takes it and the pressure is released). The measured load transfer factor is
 * applied / residual, the same ratio as the calculator's rule, applied = residual × LTF
 * (docs/REFERENCE.md §4, lib/calc/tensioner.ts).
 */

export type ToolCoverage = 100 | 50;

/**
 * How many studs a library method's tool set pulls at once (stored on the method,
 * `methods.tensioner_coverage`): a tool on every stud (100 % tensioner coverage), a tool on every
 * second stud (50 %), or one tool moved stud by stud. Torque methods are always `one_stud`.
 * The same list as models/method.ts, repeated so the browser does not import the model (`satisfies`
 * keeps the two in step at compile time).
 */
export const TENSIONER_COVERAGES = ['every_stud', 'every_second_stud', 'one_stud'] as const satisfies readonly StoredCoverage[];
export type TensionerCoverage = (typeof TENSIONER_COVERAGES)[number];

export const TENSIONER_COVERAGE_LABELS: Record<TensionerCoverage, string> = {
  every_stud: '100 % tensioner coverage: a tool on every stud',
  every_second_stud: '50 % tensioner coverage: a tool on every second stud',
  one_stud: 'One tool, moved stud by stud',
};

/** The coverage in a few words, for tables. */
export const TENSIONER_COVERAGE_SHORT: Record<TensionerCoverage, string> = {
  every_stud: '100 % coverage',
  every_second_stud: '50 % coverage',
  one_stud: 'one tool, stud by stud',
};

/** The step model's coverage of a stored method coverage; null = one stud per step. */
export const toolCoverageOf = (coverage: TensionerCoverage | null | undefined): ToolCoverage | null =>
  coverage === 'every_stud' ? 100 : coverage === 'every_second_stud' ? 50 : null;

/**
 * The groups of one pass of a method on a joint of `studCount` studs: the coverage's groups, or one
 * group per stud in the pass's `order` when one tool moves stud by stud.
 */
export function passGroups(order: readonly number[], studCount: number, coverage: TensionerCoverage | null | undefined): number[][] {
  const tool = toolCoverageOf(coverage);
  return tool === null ? order.map((p) => [p]) : tensionerStepGroups(studCount, tool);
}

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

/** The positions a step tightened: its covers for a multi-stud (tensioner) step, else its one position. */
export function stepPositions(step: Pick<NormalisedStep, 'position' | 'covers'>): number[] {
  return step.covers && step.covers.length > 0 ? step.covers.map((c) => c.position) : [step.position];
}

/** One stud's last tensioner pull: applied and residual load in N and the measured load transfer factor. */
export interface StudTransfer {
  position: number;
  appliedN: number;
  residualN: number;
  /** applied ÷ residual; null when the residual is not above zero. */
  measuredLtf: number | null;
  /** The pass of the pull. */
  pass: number;
}

/**
 * Per stud, the last step that covered it with an applied and residual load (the final pull), in
 * position order; studs no tensioner step covered are left out. Empty for a torque run.
 */
export function studTransfers(run: Pick<NormalisedRun, 'steps'>): StudTransfer[] {
  const last = new Map<number, StudTransfer>();
  const ordered = [...run.steps].sort((a, b) => a.order - b.order);
  for (const step of ordered) {
    for (const cover of step.covers ?? []) {
      const [measuredLtf] = measuredLoadTransferFactors([cover.appliedN], [cover.residualN]);
      last.set(cover.position, { position: cover.position, appliedN: cover.appliedN, residualN: cover.residualN, measuredLtf: measuredLtf ?? null, pass: step.pass });
    }
  }
  return [...last.values()].sort((a, b) => a.position - b.position);
}

/** The load transfer factor the calculator's rule gives for a joint, to set beside the measured ones. */
export interface CalculatorLtf {
  ltf: number;
  /** The rule in words, for the screen. */
  rule: string;
  /** False when the joint has no clamped length, so only the rule's floor is known. */
  fromClampLength: boolean;
}

/**
 * The calculator's default rule (`tens1`: 1.01 + D/L, at least 1.15; lib/calc/tensioner.ts,
 * docs/REFERENCE.md §4) for a stud of diameter D and clamped length L in mm; without L, the floor
 * 1.15. Measured factors of about 1.1 to 1.4 are usual, higher for short clamped lengths (from
 * memory): a measured value far outside that is worth a look at the gauges.
 */
export function calculatorLtf(diameterMm: number, clampLengthMm: number | null): CalculatorLtf {
  const rule = LTF_RULES.find((r) => r.id === 'tens1')!;
  if (clampLengthMm === null || !(clampLengthMm > 0)) return { ltf: rule.floor, rule: `${rule.label} (the floor: the joint has no clamped length)`, fromClampLength: false };
  return { ltf: loadTransferFactor('tens1', diameterMm, clampLengthMm), rule: rule.label, fromClampLength: true };
}
