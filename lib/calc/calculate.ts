import { z } from 'zod';
import { isAppError } from '@/lib/http/errors';
import { gradeProperties, type GradeId, type GradeProperties } from './grades';
import { MEASURED_K_RANGE } from './nut-factors';
import { percentOfYield, preloadFromPercentOfYield, preloadFromStress, preloadWarnings } from './preload';
import { appliedTensionerLoad, loadTransferFactor, tensionerPressureMpa, type LtfRule } from './tensioner';
import { threadGeometry, threadSpecSchema, type ThreadGeometry, type ThreadSpec } from './thread';
import { equivalentNutFactor, longFormArm, meanBearingDiameter, shortFormTorqueNm, type LongFormArm } from './torque';
import { mpaToBar } from './units';
import type { CalcWarning } from './warnings';

/**
 * The whole calculator as one pure function: inputs in calculation units (mm, mm², MPa), results
 * in the same units, plus one sentence per invalid field and the warnings to show. Sections whose
 * inputs are invalid are left out; the others are still computed, so one bad field does not blank
 * the page.
 */

export type CalculatorField =
  | 'diameter'
  | 'threadsPerInch'
  | 'pitch'
  | 'grade'
  | 'targetPercent'
  | 'targetStress'
  | 'nutFactor'
  | 'muThread'
  | 'muBearing'
  | 'bearingOd'
  | 'holeDiameter'
  | 'clampLength'
  | 'ltf'
  | 'pistonArea';

/** Calculator inputs, every number in calculation units (mm, mm², MPa); NaN for an empty or unreadable field. */
export interface CalculatorInputs {
  thread: ThreadSpec;
  grade: GradeId;
  target: { kind: 'percentOfYield'; percent: number } | { kind: 'stress'; stressMpa: number };
  nutFactor: number;
  longForm: { muThread: number; muBearing: number; bearingOdMm: number; holeDiameterMm: number };
  tensioner: {
    ltf: { kind: 'rule'; rule: LtfRule; clampLengthMm: number } | { kind: 'custom'; value: number };
    /** Total piston area of the tool, mm²; `null` when not given. */
    pistonAreaMm2: number | null;
  };
}

export interface CalculatorResult {
  errors: Partial<Record<CalculatorField, string>>;
  thread?: ThreadGeometry;
  grade?: GradeProperties;
  preload?: { forceN: number; stressMpa: number; percentOfYield: number };
  shortForm?: { torqueNm: number };
  longForm?: {
    torqueNm: number;
    arm: LongFormArm;
    bearingDiameterMm: number;
    equivalentNutFactor: number;
    /** Share of the torque that goes into stretching the stud (pitch term), 0–1. */
    pitchShare: number;
  };
  tensioner?: { ltf: number; appliedN: number; appliedPercentOfYield: number; pressureMpa: number | null };
  warnings: CalcWarning[];
}

// "Nut factor (K)" → "nut factor (K)" for the middle of a sentence.
const inSentence = (what: string) => what.charAt(0).toLowerCase() + what.slice(1);
const ranged = (what: string, min: number, max: number, range: string) =>
  z
    .number({ error: `Enter the ${inSentence(what)} as a number.` })
    .min(min, { error: `${what} must be between ${range}.` })
    .max(max, { error: `${what} must be between ${range}.` });
const positive = (what: string) =>
  z.number({ error: `Enter the ${inSentence(what)} as a number.` }).positive({ error: `${what} must be more than zero.` });

const SCHEMAS = {
  targetPercent: ranged('Percent of yield', 1, 120, '1 % and 120 %'),
  targetStress: positive('Target stress'),
  nutFactor: ranged('Nut factor (K)', 0.05, 0.6, '0.05 and 0.60'),
  muThread: ranged('Thread friction coefficient', 0, 0.5, '0 and 0.5'),
  muBearing: ranged('Bearing friction coefficient', 0, 0.5, '0 and 0.5'),
  bearingOd: positive('Nut bearing diameter'),
  holeDiameter: positive('Hole diameter'),
  clampLength: positive('Clamped length'),
  ltf: ranged('Load transfer factor', 1, 2, '1.00 and 2.00'),
  pistonArea: positive('Piston area'),
} satisfies Partial<Record<CalculatorField, z.ZodType<number>>>;

/** Runs the whole calculator. Never throws for bad input: problems come back in `errors`. */
export function computeCalculator(inputs: CalculatorInputs): CalculatorResult {
  const errors: CalculatorResult['errors'] = {};
  const warnings: CalcWarning[] = [];
  const result: CalculatorResult = { errors, warnings };

  const check = (field: keyof typeof SCHEMAS, value: number): number | undefined => {
    const r = SCHEMAS[field].safeParse(value);
    if (r.success) return r.data;
    errors[field] = r.error.issues[0]?.message ?? 'This value is not valid.';
    return undefined;
  };

  // Thread.
  const t = threadSpecSchema.safeParse(inputs.thread);
  if (!t.success) {
    for (const issue of t.error.issues) {
      const key = issue.path[0];
      const field: CalculatorField =
        key === 'threadsPerInch' ? 'threadsPerInch' : key === 'pitchMm' ? 'pitch' : 'diameter';
      errors[field] ??= issue.message;
    }
  } else {
    result.thread = threadGeometry(t.data);
  }
  const geo = result.thread;

  // Grade.
  if (geo) {
    try {
      result.grade = gradeProperties(inputs.grade, geo.diameterMm);
    } catch (e) {
      if (!isAppError(e)) throw e;
      errors.grade = e.message;
    }
  }
  const grade = result.grade;

  // Target preload.
  const target = inputs.target;
  const tValue = target.kind === 'percentOfYield' ? check('targetPercent', target.percent) : check('targetStress', target.stressMpa);
  if (geo && grade && tValue !== undefined) {
    const area = geo.tensileStressAreaMm2;
    const forceN =
      target.kind === 'percentOfYield' ? preloadFromPercentOfYield(tValue, grade.yieldMpa, area) : preloadFromStress(tValue, area);
    result.preload = { forceN, stressMpa: forceN / area, percentOfYield: percentOfYield(forceN, area, grade.yieldMpa) };
  }
  const preload = result.preload;

  // Short form.
  const k = check('nutFactor', inputs.nutFactor);
  if (k !== undefined && (k < MEASURED_K_RANGE.min || k > MEASURED_K_RANGE.max)) {
    warnings.push({
      code: 'k-outside-measured',
      severity: 'caution',
      message: `A nut factor of ${k} lies outside the 0.086–0.52 span of measured mean values; check where it comes from.`,
      source: MEASURED_K_RANGE.source,
    });
  }
  if (geo && preload && k !== undefined) {
    result.shortForm = { torqueNm: shortFormTorqueNm(k, geo.diameterMm, preload.forceN) };
  }

  // Long form.
  const lf = inputs.longForm;
  const muT = check('muThread', lf.muThread);
  const muB = check('muBearing', lf.muBearing);
  const od = check('bearingOd', lf.bearingOdMm);
  const hole = check('holeDiameter', lf.holeDiameterMm);
  if (od !== undefined && hole !== undefined && hole >= od) {
    errors.holeDiameter = 'The hole must be smaller than the nut bearing diameter.';
  } else if (geo && od !== undefined && od <= geo.diameterMm) {
    errors.bearingOd = 'The nut bearing diameter must be larger than the stud diameter.';
  } else if (geo && preload && muT !== undefined && muB !== undefined && od !== undefined && hole !== undefined) {
    const Db = meanBearingDiameter(od, hole);
    const li = { pitchMm: geo.pitchMm, pitchDiameterMm: geo.pitchDiameterMm, muThread: muT, muBearing: muB, bearingDiameterMm: Db };
    const arm = longFormArm(li);
    result.longForm = {
      torqueNm: (preload.forceN * arm.totalMm) / 1000,
      arm,
      bearingDiameterMm: Db,
      equivalentNutFactor: equivalentNutFactor(geo.diameterMm, li),
      pitchShare: arm.pitchMm / arm.totalMm,
    };
  }

  // Tensioner.
  const ltfIn = inputs.tensioner.ltf;
  let ltf: number | undefined;
  if (ltfIn.kind === 'rule') {
    const L = check('clampLength', ltfIn.clampLengthMm);
    if (geo && L !== undefined) ltf = loadTransferFactor(ltfIn.rule, geo.diameterMm, L);
  } else {
    ltf = check('ltf', ltfIn.value);
  }
  const piston = inputs.tensioner.pistonAreaMm2 === null ? null : check('pistonArea', inputs.tensioner.pistonAreaMm2);
  if (preload && grade && geo && ltf !== undefined) {
    const appliedN = appliedTensionerLoad(preload.forceN, ltf);
    const pressureMpa = piston === null || piston === undefined ? null : tensionerPressureMpa(appliedN, piston);
    result.tensioner = {
      ltf,
      appliedN,
      appliedPercentOfYield: percentOfYield(appliedN, geo.tensileStressAreaMm2, grade.yieldMpa),
      pressureMpa,
    };
    if (pressureMpa !== null && mpaToBar(pressureMpa) > 1500) {
      warnings.push({
        code: 'pressure-high',
        severity: 'caution',
        // 700–1500 bar for tensioners is from memory, unverified (docs/REFERENCE.md §8).
        message: 'The tool pressure is above 1500 bar, more than tensioners are usually rated for; check the tool’s rated pressure.',
        source: "the tensioner maker's rating plate and instructions",
      });
    }
  }

  if (preload) {
    warnings.unshift(
      ...preloadWarnings({
        residualPercentOfYield: preload.percentOfYield,
        appliedPercentOfYield: result.tensioner?.appliedPercentOfYield,
      }),
    );
  }
  return result;
}
