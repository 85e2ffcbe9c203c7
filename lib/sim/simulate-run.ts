import type { NormalisedRun, NormalisedStep } from '@/lib/record/run-types';
import { tensionerStepGroups, type ToolCoverage } from '@/lib/calc/tensioner-coverage';
import { SimInputError } from './errors';
import { circularOrder, validatePassOrder } from './patterns';
import { createRng } from './random';

/**
 * A simple, seeded model of a gasketed flange joint tightened one stud at a time, producing the
 * same {@link NormalisedRun} shape as a real strain-gauged run. See `lib/sim/MODEL.md` for the
 * model in full, its equations, assumptions and omissions.
 *
 * Everything marked "invented model constant" below is a teaching value picked to give plausible
 * behaviour; it is not taken from a standard or a test.
 */

/** Tools the simulator knows. */
export type SimTool = 'manual_torque_wrench' | 'hydraulic_torque_wrench' | 'hydraulic_tensioner';

/** One pass of a tightening method: an aim as % of the target load and the order of positions. */
export interface SimPass {
  percentOfTarget: number;
  /** Positions 1..studCount, each exactly once. */
  order: number[];
}

export interface SimMethod {
  tool: SimTool;
  passes: SimPass[];
  /** Circular passes (1..N) at 100 % after the listed passes, repeated this many times. */
  checkPasses: number;
  /**
   * Tensioner only: tool coverage. 100 = every stud in one step per pass, 50 = the odd positions
   * then the even ones (lib/calc/tensioner-coverage.ts); the pass order is then not used. Absent =
   * one stud per step in the pass order.
   */
  coverage?: ToolCoverage;
}

export interface SimLubricant {
  /** Nominal nut factor K (T = K·D·F, docs/REFERENCE.md §3 ✓ [SPR]). Used by the operator to set the torque. */
  nominalK: number;
  /** Stud-to-stud coefficient of variation of K within one run (e.g. 0.10 dry, 0.05 good paste). */
  kScatterCv: number;
  /** Run-to-run CV of the mean K (batch, amount applied, surface condition). Default 0. */
  runToRunCv?: number;
}

/** Gasket stiffness class, or the interaction coefficient c1 at circular distance 1 as a number. */
export type GasketStiffness = 'soft' | 'medium' | 'stiff' | number;

export interface SimulateRunInput {
  studCount: number;
  /** Target residual stud load in N. */
  targetLoadN: number;
  /** Nominal stud diameter D in m (for T = K·D·F). */
  studDiameterM: number;
  method: SimMethod;
  lubricant: SimLubricant;
  gasketStiffness: GasketStiffness;
  /** Seed of the run's generator; same seed and input → same run. */
  seed: number;
  /** Ratio c(k+1)/c(k) of the interaction coefficients. Default 0.5 (invented model constant). */
  interactionDecay?: number;
  /** Tensioner load transfer factor used to set the applied load. Default 1.15 (docs/REFERENCE.md §4, floor of ✓ [TENS1]). */
  loadTransferFactor?: number;
  /** Stud-to-stud CV of the actual load transfer factor. Default 0.05 (invented model constant: hand run-down of the nut varies). */
  loadTransferFactorCv?: number;
  /**
   * CV of the operator's set value (torque or pressure) against the intended one: wrench accuracy,
   * reading, technique. Default by tool: manual 0.04, hydraulic wrench 0.02, tensioner 0.01
   * (invented model constants). A trainee's skill is expressed through this number.
   */
  operatorNoiseCv?: number;
  /**
   * The K the operator uses to compute the torque; defaults to `lubricant.nominalK`. Set it apart
   * from the lubricant's K to show the over-stress caution of docs/REFERENCE.md §8 (a lower K than
   * assumed over-tensions studs ✓ [HBJ]).
   */
  torqueCalculationK?: number;
  /** Upper bound of the snug (hand-tight) load before the first step, as a fraction of target. Default 0.05. */
  snugMaxFraction?: number;
  /** Tensioner piston area in m². Default 1.0e-3 m² (10 cm², an invented tool). */
  tensionerPistonAreaM2?: number;
  /** Hydraulic torque wrench output in N·m per bar. Default 1.5 (an invented tool). */
  hydraulicWrenchNmPerBar?: number;
  /**
   * Flange rotation (cocking) factor r: while the studs' load is lopsided, pulling a stud up
   * tilts the flange about the gasket and eases the studs on the side already pulled down, by
   * r · c1 · I · w_q · ΔF (c1 = the interaction coefficient at distance 1, I = imbalance of the
   * loads, w_q = how far stud q lies on the loaded side; see MODEL.md). Scaling by c1 keeps a
   * rigid joint (c1 = 0) free of both effects. Default 1.5 (invented model constant); 0 switches
   * the term off.
   */
  flangeRotation?: number;
}

export interface SimulateRunMeta {
  seed: number;
  /** Interaction coefficient c(k) for k = 1..floor(N/2); index 0 is k = 1. */
  interactionCoefficients: number[];
  /** The nut factor actually drawn for each stud (index 0 = position 1). Present for torque tools. */
  kActualPerStud: number[] | null;
  /** The run's drawn K bias (K_actual = K_nom·(1 + bias)·(1 + stud noise)). */
  kRunBias: number | null;
  /** The load transfer factor actually drawn for each stud. Present for the tensioner. */
  ltfActualPerStud: number[] | null;
  /** Stud loads before the first step (snug), in N. */
  initialLoadsN: number[];
  operatorNoiseCv: number;
  tensionerPistonAreaM2: number | null;
  hydraulicWrenchNmPerBar: number | null;
  /** The flange rotation factor r used (0 = term off); the easing is r · c1 · I · w_q per unit ΔF. */
  flangeRotation: number;
  /** Name and version of the model, for provenance. */
  model: 'evenload-linear-interaction-v2';
}

export interface SimulateRunResult {
  run: NormalisedRun;
  meta: SimulateRunMeta;
}

/** Interaction coefficient c1 by gasket class. Invented model constants (see MODEL.md). */
export const GASKET_INTERACTION_C1 = { soft: 0.12, medium: 0.07, stiff: 0.03 } as const;

/** Default operator noise CV by tool. Invented model constants. */
export const DEFAULT_OPERATOR_NOISE_CV: Record<SimTool, number> = {
  manual_torque_wrench: 0.04,
  hydraulic_torque_wrench: 0.02,
  hydraulic_tensioner: 0.01,
};

/** Seconds per step [min, max) by tool, and the pause between passes. Invented, plausible figures. */
const STEP_SECONDS: Record<SimTool, readonly [number, number]> = {
  manual_torque_wrench: [20, 40],
  hydraulic_torque_wrench: [30, 50],
  hydraulic_tensioner: [60, 100],
};
const PASS_PAUSE_SECONDS: readonly [number, number] = [30, 90];

const TOOLS: readonly SimTool[] = ['manual_torque_wrench', 'hydraulic_torque_wrench', 'hydraulic_tensioner'];

/**
 * The interaction coefficients c(k) = c1·decay^(k−1) for circular distances k = 1..floor(N/2).
 *
 * @throws {SimInputError} for an unknown gasket class, c1 outside [0, 0.5] or decay outside [0, 1].
 */
export function interactionCoefficients(studCount: number, gasket: GasketStiffness, decay = 0.5): number[] {
  const c1 = typeof gasket === 'number' ? gasket : GASKET_INTERACTION_C1[gasket];
  if (c1 === undefined || !Number.isFinite(c1) || c1 < 0 || c1 > 0.5) {
    throw new SimInputError("interactionCoefficients requires gasketStiffness 'soft', 'medium', 'stiff' or a number in [0, 0.5]");
  }
  if (!Number.isFinite(decay) || decay < 0 || decay > 1) {
    throw new SimInputError('interactionCoefficients requires an interactionDecay in [0, 1]');
  }
  return Array.from({ length: Math.floor(studCount / 2) }, (_, i) => c1 * decay ** i);
}

/** Default flange rotation factor r. Invented model constant (see MODEL.md, "Flange rotation"). */
export const DEFAULT_FLANGE_ROTATION = 1.5;

/**
 * The flange rotation share of each stud q: I · w_q, where I = |Σ F_r·u_r| / Σ F_r is the
 * imbalance of the loads (0 = even all round, 1 = all on one stud), u_r the unit vector of stud r
 * and w_q = max(0, u_q · ê) how far q lies on the loaded side ê = Σ F_r·u_r / |Σ F_r·u_r|.
 * The tightened stud itself gets 0.
 */
export function rotationEasing(loads: readonly number[], tightened: number): number[] {
  const n = loads.length;
  let sx = 0;
  let sy = 0;
  let total = 0;
  const unit = (q: number) => {
    const angle = (2 * Math.PI * (q - 1)) / n;
    return { x: Math.sin(angle), y: Math.cos(angle) };
  };
  loads.forEach((load, i) => {
    const u = unit(i + 1);
    sx += load * u.x;
    sy += load * u.y;
    total += load;
  });
  const length = Math.hypot(sx, sy);
  // Below 1e-9 the imbalance is rounding in the sines and cosines of an even ring, not a tilt.
  if (total <= 0 || length / total < 1e-9) return Array<number>(n).fill(0);
  const imbalance = length / total;
  return loads.map((_, i) => {
    if (i + 1 === tightened) return 0;
    const u = unit(i + 1);
    return imbalance * Math.max(0, (u.x * sx + u.y * sy) / length);
  });
}

/** Circular distance between positions a and b (1-based) on a ring of n studs. */
function circularDistance(a: number, b: number, n: number): number {
  const d = Math.abs(a - b);
  return Math.min(d, n - d);
}

function requireFinite(name: string, value: number, test: (v: number) => boolean, what: string): void {
  if (!Number.isFinite(value) || !test(value)) {
    throw new SimInputError(`simulateRun requires ${what} (${name} = ${String(value)})`);
  }
}

/**
 * Simulates one run: a joint tightened stud by stud through the method's passes and check passes.
 *
 * Model (details in MODEL.md):
 * - **Torque tools.** The operator sets T = K_calc·D·F_aim (K_calc = the nominal K), applied with
 *   a factor (1 + operator noise). The stud would reach F = T/(K_actual·D) with
 *   K_actual = K_nom·(1 + runBias)·(1 + studNoise). The nut only turns if that exceeds the stud's
 *   current load: new = max(current, F).
 * - **Tensioner.** Applied load = F_aim·LTF·(1 + operator noise). If it exceeds the current load,
 *   the nut is run down and the residual is applied / LTF_actual (which may be lower than the
 *   current load: the stud is re-seated); otherwise nothing changes.
 * - **Elastic interaction.** A change ΔF at position p changes every other stud q by
 *   −c(k)·ΔF, k the circular distance, c(k) = c1·decay^(k−1); loads never go below 0.
 * - **Time.** Each step takes a seeded 20–40 s (manual), 30–50 s (hydraulic wrench) or 60–100 s
 *   (tensioner), plus 30–90 s between passes.
 *
 * Normal draws are clamped at ±3σ so that factors stay physical.
 *
 * @throws {SimInputError} for invalid input (names the field), including a pass order that does
 * not cover every stud exactly once.
 * @example
 * const { run } = simulateRun({ studCount: 8, targetLoadN: 52_800, studDiameterM: 0.015875,
 *   method: { tool: 'manual_torque_wrench', passes: [{ percentOfTarget: 100, order: crossPatternOrder(8) }], checkPasses: 1 },
 *   lubricant: { nominalK: 0.15, kScatterCv: 0.05 }, gasketStiffness: 'medium', seed: 1 });
 * run.steps.length // 16: one cross pass and one circular check pass
 */
export function simulateRun(input: SimulateRunInput): SimulateRunResult {
  const { studCount: n, targetLoadN, studDiameterM, method, lubricant, seed } = input;
  requireFinite('studCount', n, (v) => Number.isInteger(v) && v >= 2, 'an integer studCount of at least 2');
  requireFinite('targetLoadN', targetLoadN, (v) => v > 0, 'a positive targetLoadN');
  requireFinite('studDiameterM', studDiameterM, (v) => v > 0 && v < 1, 'a studDiameterM in metres, between 0 and 1');
  if (!Number.isInteger(seed)) throw new SimInputError('simulateRun requires an integer seed');
  if (!TOOLS.includes(method.tool)) throw new SimInputError(`simulateRun requires a known tool (got ${String(method.tool)})`);
  requireFinite('method.checkPasses', method.checkPasses, (v) => Number.isInteger(v) && v >= 0, 'a non-negative integer checkPasses');
  if (method.passes.length + method.checkPasses === 0) {
    throw new SimInputError('simulateRun requires at least one pass or check pass');
  }
  method.passes.forEach((pass, i) => {
    requireFinite(`method.passes[${i}].percentOfTarget`, pass.percentOfTarget, (v) => v > 0 && v <= 150, 'a percentOfTarget in (0, 150]');
    const check = validatePassOrder(pass.order, n);
    if (!check.valid) throw new SimInputError(`simulateRun requires a complete pass order: pass ${i + 1} ${check.message ?? ''}`);
  });
  requireFinite('lubricant.nominalK', lubricant.nominalK, (v) => v > 0 && v < 1, 'a nominalK in (0, 1)');
  requireFinite('lubricant.kScatterCv', lubricant.kScatterCv, (v) => v >= 0 && v <= 0.3, 'a kScatterCv in [0, 0.3]');
  const runToRunCv = lubricant.runToRunCv ?? 0;
  requireFinite('lubricant.runToRunCv', runToRunCv, (v) => v >= 0 && v <= 0.3, 'a runToRunCv in [0, 0.3]');
  const kCalc = input.torqueCalculationK ?? lubricant.nominalK;
  requireFinite('torqueCalculationK', kCalc, (v) => v > 0 && v < 1, 'a torqueCalculationK in (0, 1)');
  const ltfNominal = input.loadTransferFactor ?? 1.15;
  requireFinite('loadTransferFactor', ltfNominal, (v) => v >= 1 && v <= 2, 'a loadTransferFactor in [1, 2]');
  const ltfCv = input.loadTransferFactorCv ?? 0.05;
  requireFinite('loadTransferFactorCv', ltfCv, (v) => v >= 0 && v <= 0.2, 'a loadTransferFactorCv in [0, 0.2]');
  const operatorNoiseCv = input.operatorNoiseCv ?? DEFAULT_OPERATOR_NOISE_CV[method.tool];
  requireFinite('operatorNoiseCv', operatorNoiseCv, (v) => v >= 0 && v <= 0.3, 'an operatorNoiseCv in [0, 0.3]');
  const snugMax = input.snugMaxFraction ?? 0.05;
  requireFinite('snugMaxFraction', snugMax, (v) => v >= 0 && v <= 0.2, 'a snugMaxFraction in [0, 0.2]');
  const pistonArea = input.tensionerPistonAreaM2 ?? 1.0e-3;
  requireFinite('tensionerPistonAreaM2', pistonArea, (v) => v > 0, 'a positive tensionerPistonAreaM2');
  const wrenchNmPerBar = input.hydraulicWrenchNmPerBar ?? 1.5;
  requireFinite('hydraulicWrenchNmPerBar', wrenchNmPerBar, (v) => v > 0, 'a positive hydraulicWrenchNmPerBar');

  const rotation = input.flangeRotation ?? DEFAULT_FLANGE_ROTATION;
  requireFinite('flangeRotation', rotation, (v) => v >= 0 && v <= 5, 'a flangeRotation in [0, 5]');

  const coefficients = interactionCoefficients(n, input.gasketStiffness, input.interactionDecay ?? 0.5);
  const isTensioner = method.tool === 'hydraulic_tensioner';
  const rng = createRng(seed);

  // Draw order is fixed (snug loads, then per-stud K or LTF, then the steps) so a seed means one run.
  const loads = Array.from({ length: n }, () => rng.uniform(0, snugMax) * targetLoadN);
  const initialLoadsN = [...loads];
  let kRunBias: number | null = null;
  let kActual: number[] | null = null;
  let ltfActual: number[] | null = null;
  if (isTensioner) {
    ltfActual = Array.from({ length: n }, () => ltfNominal * rng.clampedNormal(1, ltfCv));
  } else {
    const bias = rng.clampedNormal(0, runToRunCv);
    kRunBias = bias;
    kActual = Array.from({ length: n }, () => lubricant.nominalK * (1 + bias) * rng.clampedNormal(1, lubricant.kScatterCv));
  }

  const passes: SimPass[] = [
    ...method.passes,
    ...Array.from({ length: method.checkPasses }, () => ({ percentOfTarget: 100, order: circularOrder(n) })),
  ];

  const applyChange = (position: number, delta: number): void => {
    if (delta === 0) return;
    // Flange rotation: the tilt the lopsided loads give the flange right after this pull (MODEL.md).
    const easing = rotation > 0 && delta > 0 ? rotationEasing(loads, position) : null;
    for (let q = 1; q <= n; q += 1) {
      if (q === position) continue;
      const c = coefficients[circularDistance(position, q, n) - 1] ?? 0;
      const eased = easing ? rotation * (coefficients[0] ?? 0) * (easing[q - 1] ?? 0) : 0;
      loads[q - 1] = Math.max(0, (loads[q - 1] ?? 0) - (c + eased) * delta);
    }
  };

  const [stepMin, stepMax] = STEP_SECONDS[method.tool];
  const steps: NormalisedStep[] = [];
  let timeS = 0;
  const groups = isTensioner && method.coverage ? tensionerStepGroups(n, method.coverage) : null;
  // Several studs pulled at once: each is held at its applied load while its nut is run down, so
  // a stud of the group does not ease the others; the studs outside it ease by Σ c(k)·ΔF (MODEL.md).
  const pullGroup = (group: number[], aimN: number): NormalisedStep['covers'] => {
    const covers = group.map((position) => {
      const i = position - 1;
      const current = loads[i] ?? 0;
      const appliedN = aimN * ltfNominal * rng.clampedNormal(1, operatorNoiseCv);
      const next = appliedN > current ? appliedN / (ltfActual?.[i] ?? ltfNominal) : current;
      return { position, appliedN, residualN: next, delta: next - current };
    });
    for (const c of covers) loads[c.position - 1] = c.residualN;
    for (let q = 1; q <= n; q += 1) {
      if (group.includes(q)) continue;
      const eased = covers.reduce((sum, c) => sum + (coefficients[circularDistance(c.position, q, n) - 1] ?? 0) * c.delta, 0);
      loads[q - 1] = Math.max(0, (loads[q - 1] ?? 0) - eased);
    }
    return covers.map(({ position, appliedN, residualN }) => ({ position, appliedN, residualN }));
  };
  passes.forEach((pass, passIndex) => {
    if (passIndex > 0) timeS += rng.uniform(PASS_PAUSE_SECONDS[0], PASS_PAUSE_SECONDS[1]);
    const aimN = (pass.percentOfTarget / 100) * targetLoadN;
    for (const group of groups ?? []) {
      const covers = pullGroup(group, aimN);
      timeS += rng.uniform(stepMin, stepMax);
      const meanApplied = covers!.reduce((sum, c) => sum + c.appliedN, 0) / covers!.length;
      steps.push({ order: steps.length + 1, pass: passIndex + 1, position: group[0]!, appliedTorqueNm: null, appliedPressureBar: meanApplied / pistonArea / 1e5, timeS, loadsN: [...loads], covers });
    }
    for (const position of groups ? [] : pass.order) {
      const i = position - 1;
      const current = loads[i] ?? 0;
      const setFactor = rng.clampedNormal(1, operatorNoiseCv);
      let appliedTorqueNm: number | null = null;
      let appliedPressureBar: number | null = null;
      let next = current;
      if (isTensioner) {
        const appliedN = aimN * ltfNominal * setFactor;
        appliedPressureBar = appliedN / pistonArea / 1e5;
        if (appliedN > current) next = appliedN / (ltfActual?.[i] ?? ltfNominal);
      } else {
        appliedTorqueNm = kCalc * studDiameterM * aimN * setFactor;
        const reached = appliedTorqueNm / ((kActual?.[i] ?? lubricant.nominalK) * studDiameterM);
        next = Math.max(current, reached);
        if (method.tool === 'hydraulic_torque_wrench') appliedPressureBar = appliedTorqueNm / wrenchNmPerBar;
      }
      loads[i] = next;
      applyChange(position, next - current);
      timeS += rng.uniform(stepMin, stepMax);
      steps.push({
        order: steps.length + 1,
        pass: passIndex + 1,
        position,
        appliedTorqueNm,
        appliedPressureBar,
        timeS,
        loadsN: [...loads],
        ...(isTensioner && appliedPressureBar !== null ? { covers: [{ position, appliedN: appliedPressureBar * pistonArea * 1e5, residualN: next }] } : {}),
      });
    }
  });

  return {
    run: { studCount: n, targetLoadN, steps },
    meta: {
      seed: rng.seed,
      interactionCoefficients: coefficients,
      kActualPerStud: kActual,
      kRunBias,
      ltfActualPerStud: ltfActual,
      initialLoadsN,
      operatorNoiseCv,
      tensionerPistonAreaM2: isTensioner ? pistonArea : null,
      hydraulicWrenchNmPerBar: method.tool === 'hydraulic_torque_wrench' ? wrenchNmPerBar : null,
      flangeRotation: rotation,
      model: 'evenload-linear-interaction-v2',
    },
  };
}

/** The loads after the last step of a run (the final loads), in N. */
export function finalLoadsN(run: NormalisedRun): number[] {
  const last = run.steps[run.steps.length - 1];
  return last ? [...last.loadsN] : [];
}
