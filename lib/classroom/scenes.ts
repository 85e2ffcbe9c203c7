import type { GasketForStress } from '@/lib/joints/gasket-input';
import type { NormalisedRun } from '@/lib/record/run-types';
import { coverageNeedsEvenStuds, isDryLubricant, LIBRARY_RUN_DEFAULTS, lubricantForSim, methodForSim, passWithoutOrder, simulateLibraryRun } from '@/lib/sim/from-library';
import { TENSIONER_COVERAGE_SHORT, toolCoverageOf, type TensionerCoverage } from '@/lib/calc/tensioner-coverage';
import { circularOrder, crossPatternOrder } from '@/lib/sim/patterns';
import type { SimLubricant, SimMethod, SimTool } from '@/lib/sim/simulate-run';

/**
 * The classroom's lesson scenes as pure data and functions: which joints run side by side, with
 * which method and lubricant from the library, and how they are simulated. No React, no database.
 */

export const SCENE_KEYS = ['passes', 'pattern', 'lube', 'tool', 'real'] as const;
export type SceneKey = (typeof SCENE_KEYS)[number];

export interface SceneInfo {
  key: SceneKey;
  title: string;
  /** What the scene teaches, in one sentence for the picker. */
  lesson: string;
  /** How /compare groups the saved runs. */
  compareBy: 'method' | 'lubricant' | null;
}

export const SCENES: Record<SceneKey, SceneInfo> = {
  passes: { key: 'passes', title: 'One pass or several', lesson: 'One cross pass at 100 % against 30/60/100 % cross passes and a circular check pass.', compareBy: 'method' },
  pattern: { key: 'pattern', title: 'Cross or circle', lesson: 'One pass at 100 % in cross order against one pass round the circle.', compareBy: 'method' },
  lube: { key: 'lube', title: 'Dry or lubricated', lesson: 'The same torque passes with a dry nut factor and with a paste: a lower, steadier nut factor (K).', compareBy: 'lubricant' },
  tool: { key: 'tool', title: 'Torque or tension', lesson: 'Torque wrench passes against a hydraulic tensioner with its load transfer factor.', compareBy: 'method' },
  real: { key: 'real', title: 'A measured run beside the model', lesson: 'A run the class recorded next to a simulated run of the same joint, method and lubricant.', compareBy: null },
};

/** Simulated runs per side behind the end figures and the reading. */
export const RUNS_PER_SIDE = 30;

/** Scene order from the URL (`?scenes=passes,pattern`): known keys, first mention kept; empty or unknown → all scenes. */
export function parseSceneOrder(param: string | null | undefined): SceneKey[] {
  const keys = (param ?? '')
    .split(',')
    .map((k) => k.trim())
    .filter((k): k is SceneKey => (SCENE_KEYS as readonly string[]).includes(k));
  const unique = [...new Set(keys)];
  return unique.length ? unique : [...SCENE_KEYS];
}

export function sceneOrderParam(order: readonly SceneKey[]): string {
  return order.join(',');
}

/** Moves the scene at `index` one place up (−1) or down (+1); out-of-range moves change nothing. */
export function moveScene(order: readonly SceneKey[], index: number, by: -1 | 1): SceneKey[] {
  const target = index + by;
  if (index < 0 || index >= order.length || target < 0 || target >= order.length) return [...order];
  const next = [...order];
  [next[index], next[target]] = [next[target]!, next[index]!];
  return next;
}

/** Adds a scene at the end, or takes it out (at least one scene stays). */
export function toggleScene(order: readonly SceneKey[], key: SceneKey): SceneKey[] {
  if (order.includes(key)) return order.length > 1 ? order.filter((k) => k !== key) : [...order];
  return [...order, key];
}

// ---------------------------------------------------------------------------------------------
// The library rows a scene chooses from (plain DTOs from lib/data/classroom.ts).

export interface LibraryJoint {
  id: number;
  name: string;
  studCount: number;
  targetLoadN: number;
  bandPercent: number;
  /** Nominal stud diameter D in m (T = K·D·F). */
  studDiameterM: number;
  /** The joint's gasket contact area and stress limits; null or absent when its contact area is not known. */
  gasket?: GasketForStress | null;
}

export interface LibraryMethodPass {
  percentOfTarget: number;
  pattern: 'cross' | 'circular' | 'custom';
  orderByStudCount: Record<string, number[]>;
}

export interface LibraryMethod {
  id: number;
  name: string;
  toolKind: SimTool | 'other';
  passes: LibraryMethodPass[];
  checkPasses: number;
  /** How many studs a tensioner set pulls at once (lib/calc/tensioner-coverage.ts); absent = stud by stud. */
  tensionerCoverage?: TensionerCoverage;
}

export interface LibraryLubricant {
  id: number;
  name: string;
  nominalNutFactor: number;
}

export interface Library {
  joints: LibraryJoint[];
  methods: LibraryMethod[];
  lubricants: LibraryLubricant[];
}

/** A method a scene side asks for: tool, passes (% and pattern) and check passes. */
interface MethodWanted {
  tool: SimTool;
  passes: { percentOfTarget: number; pattern: 'cross' | 'circular' }[];
  checkPasses: number;
  /** A tensioner side's tool set: a library method must pull the same studs at once. */
  tensionerCoverage?: TensionerCoverage;
}

type LubricantWanted = 'dry' | 'paste';

function pickLubricant(lubricants: readonly LibraryLubricant[], wanted: LubricantWanted): LibraryLubricant | null {
  const matching = lubricants.filter((l) => (wanted === 'dry' ? isDryLubricant(l) : !isDryLubricant(l)));
  // Dry: the highest K; paste: the lowest K (the clearest contrast).
  const sorted = [...matching].sort((a, b) => (wanted === 'dry' ? b.nominalNutFactor - a.nominalNutFactor : a.nominalNutFactor - b.nominalNutFactor) || a.id - b.id);
  return sorted[0] ?? null;
}

/** A library method that matches the wanted tool, passes and check passes, with orders for this stud count. */
export function findMethod(methods: readonly LibraryMethod[], wanted: MethodWanted, studCount: number): LibraryMethod | null {
  return (
    methods.find(
      (m) =>
        m.toolKind === wanted.tool &&
        m.checkPasses === wanted.checkPasses &&
        (wanted.tensionerCoverage === undefined || (m.tensionerCoverage ?? 'one_stud') === wanted.tensionerCoverage) &&
        m.passes.length === wanted.passes.length &&
        m.passes.every((p, i) => p.percentOfTarget === wanted.passes[i]!.percentOfTarget && p.pattern === wanted.passes[i]!.pattern && Array.isArray(p.orderByStudCount[String(studCount)])),
    ) ?? null
  );
}

/** The simulator's method for a library method (or a wanted one when the library has no match). */
function simMethodOf(method: LibraryMethod | null, wanted: MethodWanted, studCount: number): SimMethod {
  if (method) return methodForSim(method, studCount);
  const order = (pattern: 'cross' | 'circular') => (pattern === 'cross' && studCount % 4 === 0 ? crossPatternOrder(studCount) : circularOrder(studCount));
  const coverage = toolCoverageOf(wanted.tensionerCoverage);
  return { tool: wanted.tool, checkPasses: wanted.checkPasses, passes: wanted.passes.map((p) => ({ percentOfTarget: p.percentOfTarget, order: order(p.pattern) })), ...(coverage === null ? {} : { coverage }) };
}

const ONE_CROSS: MethodWanted = { tool: 'manual_torque_wrench', passes: [{ percentOfTarget: 100, pattern: 'cross' }], checkPasses: 0 };
const ONE_CIRCLE: MethodWanted = { tool: 'manual_torque_wrench', passes: [{ percentOfTarget: 100, pattern: 'circular' }], checkPasses: 0 };
const THREE_CROSS_CHECK: MethodWanted = {
  tool: 'manual_torque_wrench',
  passes: [30, 60, 100].map((percentOfTarget) => ({ percentOfTarget, pattern: 'cross' as const })),
  checkPasses: 1,
};
/** Two passes with a tool on every stud (100 % tensioner coverage): a library tensioner method must have the same coverage. */
const TENSIONER_TWO: MethodWanted = { tool: 'hydraulic_tensioner', passes: [100, 100].map((percentOfTarget) => ({ percentOfTarget, pattern: 'cross' as const })), checkPasses: 0, tensionerCoverage: 'every_stud' };

/** One joint of a scene, simulated or recorded. */
export interface SceneSide {
  key: string;
  label: string;
  /** What is different on this side, in a few words for the projector. */
  caption: string;
  methodId: number | null;
  methodName: string;
  lubricantId: number | null;
  lubricantName: string;
  simMethod: SimMethod;
  simLubricant: SimLubricant;
  /** The method's % of target per pass, check passes appended (for the chart's pass labels). */
  passPercents: number[];
}

export interface SceneSetup {
  scene: SceneKey;
  joint: LibraryJoint;
  sides: SceneSide[];
  /** Sentences naming library rows that were not found (the scene still runs on built-in settings, but cannot be saved). */
  missing: string[];
}

/** The lubricants a side runs on when the library has none to match (a MoS₂ paste and Shigley's dry 0.20, docs/REFERENCE.md §3). */
const BUILT_IN_PASTE = { nominalNutFactor: 0.12 };
const BUILT_IN_DRY = { nominalNutFactor: 0.2 };

function side(key: string, label: string, caption: string, method: LibraryMethod | null, wanted: MethodWanted, lubricant: LibraryLubricant | null, studCount: number): SceneSide {
  const simMethod = simMethodOf(method, wanted, studCount);
  return {
    key,
    label,
    caption,
    methodId: method?.id ?? null,
    methodName: method?.name ?? describeWanted(wanted),
    lubricantId: lubricant?.id ?? null,
    lubricantName: lubricant?.name ?? 'Paste, K 0.12',
    simMethod,
    simLubricant: lubricantForSim(lubricant ?? BUILT_IN_PASTE),
    passPercents: [...simMethod.passes.map((p) => p.percentOfTarget), ...Array.from({ length: simMethod.checkPasses }, () => 100)],
  };
}

function describeWanted(wanted: MethodWanted): string {
  const passes = wanted.passes.map((p) => `${p.percentOfTarget} % ${p.pattern}`).join(', ');
  const coverage = wanted.tensionerCoverage ? `, ${TENSIONER_COVERAGE_SHORT[wanted.tensionerCoverage]}` : '';
  return `${wanted.tool.replaceAll('_', ' ')}: ${passes}${wanted.checkPasses ? ` + ${wanted.checkPasses} circular check` : ''}${coverage}`;
}

/**
 * The sides of a simulated scene on a joint, choosing existing library rows wherever they match.
 * Each side's method and lubricant come from the library when a row fits; otherwise the side runs
 * on built-in settings and `missing` says which row to add in the joint library.
 */
export function sceneSetup(scene: Exclude<SceneKey, 'real'>, library: Library, jointId: number): SceneSetup | null {
  const joint = library.joints.find((j) => j.id === jointId);
  if (!joint) return null;
  const n = joint.studCount;
  const missing: string[] = [];
  const method = (wanted: MethodWanted) => {
    const found = findMethod(library.methods, wanted, n);
    if (!found) missing.push(`No method in the library is "${describeWanted(wanted)}" with an order for ${n} studs.`);
    return found;
  };
  const lubricant = (wanted: LubricantWanted) => {
    const found = pickLubricant(library.lubricants, wanted);
    if (!found) missing.push(`No ${wanted === 'dry' ? 'dry lubricant (K of 0.18 or more)' : 'paste (K below 0.18)'} in the library.`);
    return found;
  };
  const paste = lubricant('paste');
  let sides: SceneSide[];
  switch (scene) {
    case 'passes':
      sides = [
        side('one-pass', 'One pass', 'one cross pass at 100 %', method(ONE_CROSS), ONE_CROSS, paste, n),
        side('several', 'Several passes', '30 / 60 / 100 % cross + circular check', method(THREE_CROSS_CHECK), THREE_CROSS_CHECK, paste, n),
      ];
      break;
    case 'pattern':
      sides = [
        side('cross', 'Cross order', 'one pass at 100 %, cross order', method(ONE_CROSS), ONE_CROSS, paste, n),
        side('circle', 'Round the circle', 'one pass at 100 %, 1, 2, 3 … clockwise', method(ONE_CIRCLE), ONE_CIRCLE, paste, n),
      ];
      break;
    case 'lube': {
      const m = method(THREE_CROSS_CHECK);
      const dry = lubricant('dry');
      sides = [
        side('dry', 'Dry', `nut factor K ${dry?.nominalNutFactor ?? 0.2}, scatters more`, m, THREE_CROSS_CHECK, dry, n),
        side('paste', 'Lubricated', `nut factor K ${paste?.nominalNutFactor ?? 0.12}, steadier`, m, THREE_CROSS_CHECK, paste, n),
      ];
      if (!dry) sides[0]!.simLubricant = lubricantForSim(BUILT_IN_DRY);
      break;
    }
    case 'tool':
      sides = [
        side('torque', 'Torque wrench', '30 / 60 / 100 % cross + check, torque through K', method(THREE_CROSS_CHECK), THREE_CROSS_CHECK, paste, n),
        side('tension', 'Hydraulic tensioner', `two passes, every stud at once (100 % tool coverage), load transfer factor ${DEFAULT_LTF}`, method(TENSIONER_TWO), TENSIONER_TWO, paste, n),
      ];
      // A tool on every stud: each pass is one step that covers them all (the method's coverage, lib/calc/tensioner-coverage.ts).
      break;
  }
  return { scene, joint, sides, missing };
}

/** Load transfer factor the tensioner side uses: the library adapter's, floor of ✓ [TENS1] (docs/REFERENCE.md §4). */
const DEFAULT_LTF = LIBRARY_RUN_DEFAULTS.loadTransferFactor;

/** A side of the "real run" scene that simulates the real run's own joint, method and lubricant. */
export function sideForRealRun(joint: LibraryJoint, method: LibraryMethod, lubricant: LibraryLubricant): SceneSide {
  const wanted: MethodWanted = {
    tool: method.toolKind === 'other' ? 'manual_torque_wrench' : method.toolKind,
    passes: method.passes.map((p) => ({ percentOfTarget: p.percentOfTarget, pattern: p.pattern === 'circular' ? 'circular' : 'cross' })),
    checkPasses: method.checkPasses,
  };
  const hasOrders = passWithoutOrder(method, joint.studCount) === null && !coverageNeedsEvenStuds(method, joint.studCount);
  return side('model', 'The model', `${method.name}, ${lubricant.name}`, hasOrders ? method : null, wanted, lubricant, joint.studCount);
}

/**
 * Simulates one side with one seed (same seed on every side of a scene, so the comparison is
 * fair), through the same library adapter as Record's "Simulate" (medium gasket): a side on
 * library rows gives the run Record gives for those rows and seed.
 */
export function simulateSide(sideToRun: SceneSide, joint: LibraryJoint, seed: number): NormalisedRun {
  return simulateLibraryRun({ joint, method: sideToRun.simMethod, lubricant: sideToRun.simLubricant, seed }).run;
}

/** The seed family of a scene: runs k = 0..count−1 use seed + k on every side. */
export function seedFamily(seed: number, count = RUNS_PER_SIDE): number[] {
  return Array.from({ length: count }, (_, k) => seed + k);
}
