import { inchTensileStressAreaIn2 } from '@/lib/calc/thread';
import { inToMm, N_PER_LBF } from '@/lib/calc/units';
import { GASKET_TRAINING_DEFAULTS, TRAINING_DEFAULT_SOURCE } from '@/lib/joints/gasket-input';
import { SimInputError } from '@/lib/sim/errors';
import { lubricantForSim } from '@/lib/sim/from-library';
import { circularOrder, crossPatternOrder } from '@/lib/sim/patterns';
import type { Rng } from '@/lib/sim/random';
import type { GasketStiffness, SimLubricant, SimTool } from '@/lib/sim/simulate-run';

/**
 * INVENTED DEMO DATA: the joint library of the fictional Brackwater Bolting School (two training
 * joints, five methods, three lubricants), seeded by seeders/…demo-scenario.ts through
 * lib/demo/demo-scenario.ts. The joints' targets follow the trade facts cited beside them; the
 * names, calibration factors and scatter values are invented. Pure and deterministic.
 */

export interface DemoJoint {
  key: string;
  name: string;
  nominalSize: string;
  pressureClass: string;
  studCount: number;
  /** Unified inch thread; `diameter` in inches. */
  thread: { system: 'inch'; diameter: number; threadsPerInch: number; designation: string };
  studGrade: 'ASTM A193 B7';
  nutGrade: 'ASTM A194 2H';
  gasketType: 'spiral-wound, graphite filled';
  /** Tensile stress area As in in², from As = 0.7854 (D − 0.9743/n)² (docs/REFERENCE.md §1 ✓ [EE-B1.1]). */
  tensileStressAreaIn2: number;
  /** Target stress on As in psi: 50 % of the 105 ksi B7 minimum yield (docs/REFERENCE.md §2 ✓ [NANL]; 50 % per §4 ✓ [RODERY], [ENGTIPS]). */
  targetStressPsi: number;
  /** Target stud load in N (target stress × As, converted; rounded to 1 N). */
  targetLoadN: number;
  /** Strain-gauge calibration factor per position (index 0 = position 1), near 1.0. Invented. */
  calibrationFactors: number[];
  /** Gasket class used by the simulator for this joint (invented model choice). */
  simGasketStiffness: GasketStiffness;
}

export interface DemoMethodPass {
  percentOfTarget: number;
  pattern: 'cross' | 'circular';
  /** The pass order for each stud count the demo joints use (key = stud count as a string). */
  orderByStudCount: Record<string, number[]>;
}

export interface DemoMethod {
  key: string;
  name: string;
  tool: SimTool;
  passes: DemoMethodPass[];
  /** Circular check passes at 100 % after the listed passes. */
  checkPasses: number;
  /** Where the method comes from, in words. */
  basis: string;
  /** How many studs a tensioner pulls at once (methods.tensioner_coverage); absent: one tool, stud by stud. */
  tensionerCoverage?: 'every_stud' | 'every_second_stud' | 'one_stud';
}

export interface DemoLubricant extends SimLubricant {
  key: string;
  name: string;
  /** Where the nominal K comes from. */
  basis: string;
}

/** lbf → N (exact definition of the pound-force: 0.45359237 kg × 9.80665 m/s²). */
const NEWTONS_PER_LBF = N_PER_LBF;

/**
 * Tensile stress area of a Unified inch thread, As = 0.7854 (D − 0.9743/n)² in in², from lib/calc
 * (guarded here so the demo scenario fails loudly on an impossible thread)
 * (docs/REFERENCE.md §1, ASME B1.1 ✓ [EE-B1.1]).
 *
 * @throws {SimInputError} when D or n is not positive, or the thread is impossible (D ≤ 0.9743/n).
 * @example tensileStressAreaIn2(0.75, 10) // ≈ 0.3345 (table value 0.334 ✓ [EE-AREA])
 */
export function tensileStressAreaIn2(diameterIn: number, threadsPerInch: number): number {
  if (!(diameterIn > 0) || !(threadsPerInch > 0) || diameterIn <= 0.9743 / threadsPerInch) {
    throw new SimInputError('tensileStressAreaIn2 requires a positive diameter larger than 0.9743/n and positive threads per inch');
  }
  return inchTensileStressAreaIn2(diameterIn, threadsPerInch);
}

const B7_MIN_YIELD_PSI = 105_000; // docs/REFERENCE.md §2 ✓ [NANL], [BACO], ≤ 2-1/2 in
const TARGET_FRACTION_OF_YIELD = 0.5; // docs/REFERENCE.md §4: "typically 50 %" ✓ [RODERY]; rule of thumb ✓ [ENGTIPS]

/**
 * Gasket contact rings of the demo joints, inches. INVENTED DEMO VALUES: near the sealing element of a
 * spiral-wound gasket of the size (ASME B16.20 tables; sizes from memory, unverified), not a
 * product's data. With the training stress limits below, the average gasket stress at the demo
 * targets lands just above the seating stress (computed: flange A 8 × 0.2260 in² × 52,500 psi over
 * π/4 (5.875² − 4.75²) = 9.388 in² ≈ 10,100 psi ≈ 70 MPa; flange B 12 × 0.3345 in² × 52,500 psi over
 * π/4 (8.375² − 6.75²) = 19.30 in² ≈ 10,900 psi ≈ 75 MPa), so the demo's runs straddle seating.
 */
export const DEMO_GASKET_RINGS: Record<string, { innerIn: number; outerIn: number }> = {
  'nps4-cl150-8': { innerIn: 4.75, outerIn: 5.875 },
  'nps6-cl300-12': { innerIn: 6.75, outerIn: 8.375 },
};

/** A demo joint's gasket as the joints table stores it (SI). */
export interface DemoGasket {
  innerMm: number;
  outerMm: number;
  minSeatingMpa: number;
  maxMpa: number;
  /** Shown on screen beside the limits: "training default: set your own". */
  source: string;
  flangeFacing: string;
}

/**
 * The gasket of a demo joint (null for a key without one). The contact ring is an invented demo
 * value (above); the stress limits are the training defaults every new joint starts from: seating
 * 69 MPa = 10,000 psi, the ASME VIII-1 Appendix 2 y of spiral-wound, non-asbestos filled
 * (docs/REFERENCE.md §7 ✓), maximum 207 MPa ≈ 30,000 psi (§7, from memory), labelled on screen as
 * "training default: set your own".
 */
export function demoGasketOf(jointKey: string): DemoGasket | null {
  const ring = DEMO_GASKET_RINGS[jointKey];
  if (!ring) return null;
  return { innerMm: inToMm(ring.innerIn), outerMm: inToMm(ring.outerIn), ...GASKET_TRAINING_DEFAULTS, source: TRAINING_DEFAULT_SOURCE, flangeFacing: 'Raised face' };
}

export function buildJoint(
  rng: Rng,
  key: string,
  name: string,
  nominalSize: string,
  pressureClass: string,
  studCount: number,
  diameter: number,
  threadsPerInch: number,
  designation: string,
): DemoJoint {
  const area = tensileStressAreaIn2(diameter, threadsPerInch);
  const stressPsi = TARGET_FRACTION_OF_YIELD * B7_MIN_YIELD_PSI;
  return {
    key,
    name,
    nominalSize,
    pressureClass,
    studCount,
    thread: { system: 'inch', diameter, threadsPerInch, designation },
    studGrade: 'ASTM A193 B7',
    nutGrade: 'ASTM A194 2H',
    gasketType: 'spiral-wound, graphite filled',
    tensileStressAreaIn2: area,
    targetStressPsi: stressPsi,
    targetLoadN: Math.round(stressPsi * area * NEWTONS_PER_LBF),
    calibrationFactors: Array.from({ length: studCount }, () => Math.round(rng.uniform(0.97, 1.03) * 1000) / 1000),
    simGasketStiffness: 'medium',
  };
}

function ordersFor(pattern: 'cross' | 'circular', studCounts: readonly number[]): Record<string, number[]> {
  const out: Record<string, number[]> = {};
  for (const n of studCounts) out[String(n)] = pattern === 'cross' ? crossPatternOrder(n) : circularOrder(n);
  return out;
}

export function buildMethods(studCounts: readonly number[]): DemoMethod[] {
  const pass = (percentOfTarget: number, pattern: 'cross' | 'circular'): DemoMethodPass => ({
    percentOfTarget,
    pattern,
    orderByStudCount: ordersFor(pattern, studCounts),
  });
  return [
    {
      key: 'one-pass-cross-100',
      name: 'One pass, cross order, 100 %',
      tool: 'manual_torque_wrench',
      passes: [pass(100, 'cross')],
      checkPasses: 0,
      // docs/REFERENCE.md §4 ✓ [BSCI], [MDPI].
      basis: 'Teaching case: a single full-torque pass leaves the studs tightened first low (elastic interaction).',
    },
    {
      key: 'three-pass-cross-check',
      name: 'Three cross passes 30/60/100 % + circular check',
      tool: 'manual_torque_wrench',
      passes: [pass(30, 'cross'), pass(60, 'cross'), pass(100, 'cross')],
      checkPasses: 1,
      // docs/REFERENCE.md §4 ✓ [HENNIG], [HSW].
      basis: 'Widely published simplified practice: 30/60/100 % in cross pattern plus a circular pass at 100 % (compare the legacy procedure of ASME PCC-1).',
    },
    {
      key: 'one-pass-circular-100',
      name: 'One circular pass at 100 %',
      tool: 'manual_torque_wrench',
      passes: [pass(100, 'circular')],
      checkPasses: 0,
      basis: 'Teaching case: what not to do (common practice).',
    },
    {
      key: 'tensioner-two-pass',
      name: 'Tensioner, two passes',
      tool: 'hydraulic_tensioner',
      passes: [pass(100, 'cross'), pass(100, 'cross')],
      checkPasses: 0,
      // docs/REFERENCE.md §4: applied load = residual × LTF ✓ [FE-LTF], LTF 1.15 ✓ [TENS1].
      basis: "One tool moved stud by stud, cross order, second pass to recover elastic interaction losses (common practice); applied load = residual × LTF, LTF 1.15 (training default: set your own from the tool maker's data).",
    },
    {
      // Invented demo method, so the classroom's tensioning scene (which pulls every stud) has a method to save against.
      key: 'tensioner-every-stud',
      name: 'Tensioner on every stud, two passes',
      tool: 'hydraulic_tensioner',
      passes: [pass(100, 'cross'), pass(100, 'cross')],
      checkPasses: 0,
      tensionerCoverage: 'every_stud',
      basis: "One tool on every stud, pulled together (100 % coverage), second pass to recover the load lost when the tools are released (common practice); applied load = residual × LTF, LTF 1.15 (training default: set your own from the tool maker's data).",
    },
    {
      key: 'hydraulic-wrench-three-pass',
      name: 'Hydraulic torque wrench, three cross passes 30/60/100 % + circular check',
      tool: 'hydraulic_torque_wrench',
      passes: [pass(30, 'cross'), pass(60, 'cross'), pass(100, 'cross')],
      checkPasses: 1,
      basis: 'Same passes as the manual three-pass method, hydraulic torque tool (common practice).',
    },
  ];
}

export function buildLubricants(): DemoLubricant[] {
  return [
    {
      key: 'dry',
      name: 'Dry (as received)',
      ...lubricantForSim({ nominalNutFactor: 0.2 }),
      // docs/REFERENCE.md §3: 0.20 ✓ [SHIG]; dry steel 0.18–0.27 ✓ [ZIP]. The scatter CVs are the library adapter's invented ones (lib/sim/from-library.ts).
      basis: 'K 0.20, the "condition unknown" value of Shigley & Mischke, §8-8. Scatter of K: training default, set your own.',
    },
    {
      key: 'copper-paste',
      name: 'Copper-based paste',
      ...lubricantForSim({ nominalNutFactor: 0.15 }),
      // docs/REFERENCE.md §3: 0.13–0.18 from memory, unverified; generic anti-seize 0.12 ✓ [SHIG]. The scatter CVs are the library adapter's invented ones (lib/sim/from-library.ts).
      basis: "K ≈ 0.13–0.18: training default, set your own from the paste maker's data. Scatter of K: training default, set your own.",
    },
    {
      key: 'moly-paste',
      name: 'Molybdenum disulphide paste',
      ...lubricantForSim({ nominalNutFactor: 0.12 }),
      // docs/REFERENCE.md §3: 0.10–0.14 from memory, unverified. The scatter CVs are the library adapter's invented ones (lib/sim/from-library.ts).
      basis: "K ≈ 0.10–0.14: training default, set your own from the paste maker's data. Scatter of K: training default, set your own.",
    },
  ];
}

