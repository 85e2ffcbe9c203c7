import { toolCoverageOf, type TensionerCoverage } from '@/lib/calc/tensioner-coverage';
import { SimInputError } from './errors';
import { simulateRun, type GasketStiffness, type SimLubricant, type SimMethod, type SimTool, type SimulateRunResult } from './simulate-run';

/**
 * The one adapter from the joint library (a joint, a method and a lubricant as stored) to the
 * simulator's input. Record's "Simulate", the Classroom (on screen and when it saves) and the
 * invented demo all simulate through {@link simulateLibraryRun}, so the same joint, method,
 * lubricant, gasket and seed give the same run everywhere. Pure: no database, safe in the browser.
 */

/** A library joint as the simulator needs it (D from lib/joints/joint-properties `studDiameterM`). */
export interface LibraryJointForSim {
  studCount: number;
  targetLoadN: number;
  /** Nominal stud diameter D in m (T = K·D·F). */
  studDiameterM: number;
}

/** A library method: its tool, its passes with an order per stud count, its circular check passes and its tensioner coverage. */
export interface LibraryMethodForSim {
  toolKind: SimTool | 'other';
  passes: readonly { percentOfTarget: number; orderByStudCount: Readonly<Record<string, readonly number[]>> }[];
  checkPasses: number;
  /** How many studs a tensioner set pulls at once; absent or `one_stud` = stud by stud. Ignored for torque tools. */
  tensionerCoverage?: TensionerCoverage;
}

/** A library lubricant: only its nominal nut factor is stored. */
export interface LibraryLubricantForSim {
  nominalNutFactor: number;
}

/** A nut factor at or above this is treated as dry (0.20 is Shigley's "condition unknown", docs/REFERENCE.md §3 ✓ [SHIG]). */
export const DRY_NUT_FACTOR_MIN = 0.18;

/** Below this (and not dry) a paste is read as a steady one, such as MoS₂ (K ≈ 0.10–0.14, docs/REFERENCE.md §3, from memory). */
const STEADY_PASTE_NUT_FACTOR_MAX = 0.14;

export const isDryLubricant = (lubricant: LibraryLubricantForSim): boolean => lubricant.nominalNutFactor >= DRY_NUT_FACTOR_MIN;

/**
 * How K scatters for a library lubricant, which stores only its nominal K: drier, higher-K
 * conditions scatter more. Invented teaching values (the demo lubricants carry the same ones),
 * in the spirit of docs/REFERENCE.md §5 (torque dry ±35 %, lubricated ±25 % ✓ [SPRING]); not
 * measurements. Dry (K ≥ 0.18): CV 0.10 stud to stud, 0.08 run to run; a paste of K 0.14 to
 * below 0.18 (copper-based): 0.06 and 0.04; below 0.14 (MoS₂): 0.05 and 0.04.
 */
export function lubricantForSim(lubricant: LibraryLubricantForSim): SimLubricant {
  const k = lubricant.nominalNutFactor;
  if (isDryLubricant(lubricant)) return { nominalK: k, kScatterCv: 0.1, runToRunCv: 0.08 };
  if (k >= STEADY_PASTE_NUT_FACTOR_MAX) return { nominalK: k, kScatterCv: 0.06, runToRunCv: 0.04 };
  return { nominalK: k, kScatterCv: 0.05, runToRunCv: 0.04 };
}

/** The simulator's tool for a library tool kind; "other" is simulated as a manual torque wrench. */
export const simToolOf = (toolKind: LibraryMethodForSim['toolKind']): SimTool => (toolKind === 'other' ? 'manual_torque_wrench' : toolKind);

/** The 1-based number of the first pass without an order for this stud count, or null when every pass has one. */
export function passWithoutOrder(method: LibraryMethodForSim, studCount: number): number | null {
  const index = method.passes.findIndex((pass) => !Array.isArray(pass.orderByStudCount[String(studCount)]));
  return index < 0 ? null : index + 1;
}

/** True when a library method is a tensioner whose tool set covers every second stud on a joint with an odd stud count (no such set). */
export const coverageNeedsEvenStuds = (method: LibraryMethodForSim, studCount: number): boolean =>
  method.toolKind === 'hydraulic_tensioner' && method.tensionerCoverage === 'every_second_stud' && studCount % 2 !== 0;

/**
 * The simulator's method for a library method on a joint of `studCount` studs. A tensioner method
 * whose tool set pulls several studs at once is simulated by its coverage (groups of studs per step,
 * lib/calc/tensioner-coverage.ts); torque methods and one tool moved stud by stud keep the pass order.
 * @throws {SimInputError} when a pass has no order for this stud count (check {@link passWithoutOrder} first)
 *   or when 50 % coverage meets an odd stud count (check {@link coverageNeedsEvenStuds}).
 */
export function methodForSim(method: LibraryMethodForSim, studCount: number): SimMethod {
  const missing = passWithoutOrder(method, studCount);
  if (missing !== null) throw new SimInputError(`methodForSim requires an order for ${studCount} studs in pass ${missing}`);
  if (coverageNeedsEvenStuds(method, studCount)) throw new SimInputError(`methodForSim requires an even stud count for 50 % tensioner coverage, got ${studCount}`);
  const coverage = method.toolKind === 'hydraulic_tensioner' ? toolCoverageOf(method.tensionerCoverage) : null;
  return {
    tool: simToolOf(method.toolKind),
    checkPasses: method.checkPasses,
    passes: method.passes.map((pass) => ({ percentOfTarget: pass.percentOfTarget, order: [...pass.orderByStudCount[String(studCount)]!] })),
    ...(coverage === null ? {} : { coverage }),
  };
}

/**
 * Settings the library does not store, the same on every page: a medium gasket and the simulator's
 * tensioner LTF 1.15 (floor of ✓ [TENS1], docs/REFERENCE.md §4). A library tensioner method is
 * simulated by its `tensionerCoverage` (`SimMethod.coverage` through {@link methodForSim}): a step
 * per group of studs, or one stud per step as its pass order reads when one tool is moved.
 */
export const LIBRARY_RUN_DEFAULTS = { gasketStiffness: 'medium', loadTransferFactor: 1.15 } as const;

export interface LibraryRunInput {
  joint: LibraryJointForSim;
  /** A library method through {@link methodForSim}, or a built-in one the Classroom falls back to. */
  method: SimMethod;
  /** A library lubricant through {@link lubricantForSim}. */
  lubricant: SimLubricant;
  seed: number;
  gasketStiffness?: GasketStiffness;
  /** The operator's set-value CV (the demo's trainees); the simulator's default by tool otherwise. */
  operatorNoiseCv?: number;
}

/** Simulates one run of a library joint with a method and lubricant (see lib/sim/MODEL.md). */
export function simulateLibraryRun(input: LibraryRunInput): SimulateRunResult {
  return simulateRun({
    studCount: input.joint.studCount,
    targetLoadN: input.joint.targetLoadN,
    studDiameterM: input.joint.studDiameterM,
    method: input.method,
    lubricant: input.lubricant,
    gasketStiffness: input.gasketStiffness ?? LIBRARY_RUN_DEFAULTS.gasketStiffness,
    loadTransferFactor: LIBRARY_RUN_DEFAULTS.loadTransferFactor,
    seed: input.seed,
    ...(input.operatorNoiseCv === undefined ? {} : { operatorNoiseCv: input.operatorNoiseCv }),
  });
}
