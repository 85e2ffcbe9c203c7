import { z } from 'zod';
import { gasketContactArea, type GasketLimits } from '@/lib/calc/gasket';
import { formatInputValue, fromInputUnit, toInputUnit, type Quantity, type UnitSystem } from '@/lib/calc/units';
import { isAppError } from '@/lib/http/errors';
import { parseNumberText } from '@/lib/format/parse-number';

/**
 * The gasket and flange section of the joint form, as pure functions shared by the form (its own
 * component, `components/joints/gasket-section.tsx`) and the server action. Every field is optional:
 * a joint may have no gasket data. Form fields: `gasketInner`, `gasketOuter`, `gasketArea`,
 * `gasketMinSeating`, `gasketMax`, `gasketStressSource`, `flangeFacing`, `clampLength`, typed in the
 * form's units (mm/in, mm²/in², MPa/ksi).
 */

/** The gasket and flange data of a joint, SI (mm, mm², MPa); null where not given. */
export interface JointGasket {
  innerMm: number | null;
  outerMm: number | null;
  areaMm2: number | null;
  minSeatingMpa: number | null;
  maxMpa: number | null;
  stressSource: string | null;
  flangeFacing: string | null;
  clampLengthMm: number | null;
}

/** The gasket and flange columns of a joint row, as stored (SI). */
export interface JointGasketColumns {
  gasketInnerMm?: number | null;
  gasketOuterMm?: number | null;
  gasketAreaMm2?: number | null;
  gasketMinSeatingMpa?: number | null;
  gasketMaxMpa?: number | null;
  gasketStressSource?: string | null;
  flangeFacing?: string | null;
  clampLengthMm?: number | null;
}

/** A joint row's gasket and flange data (null where not stored). */
export function jointGasketOf(joint: JointGasketColumns): JointGasket {
  return {
    innerMm: joint.gasketInnerMm ?? null,
    outerMm: joint.gasketOuterMm ?? null,
    areaMm2: joint.gasketAreaMm2 ?? null,
    minSeatingMpa: joint.gasketMinSeatingMpa ?? null,
    maxMpa: joint.gasketMaxMpa ?? null,
    stressSource: joint.gasketStressSource ?? null,
    flangeFacing: joint.flangeFacing ?? null,
    clampLengthMm: joint.clampLengthMm ?? null,
  };
}

export const NO_GASKET_DATA: JointGasket = { innerMm: null, outerMm: null, areaMm2: null, minSeatingMpa: null, maxMpa: null, stressSource: null, flangeFacing: null, clampLengthMm: null };

/** Flange facings offered (common practice terms). */
export const FLANGE_FACINGS = ['Raised face', 'Flat face', 'Ring-type joint', 'Tongue and groove', 'Male and female'] as const;

/** The source shown beside stress limits the centre has not set itself. */
export const TRAINING_DEFAULT_SOURCE = 'training default: set your own';

/**
 * Stress limits a new joint's form starts from, MPa. Seating 69 MPa = 10,000 psi, the ASME VIII-1
 * App. 2 y factor for spiral-wound gaskets (docs/REFERENCE.md §7 ✓ [PWORLD]; a design factor, not
 * an assembly target); maximum 207 MPa ≈ 30,000 psi (docs/REFERENCE.md §7, from memory, unverified).
 */
export const GASKET_TRAINING_DEFAULTS = { minSeatingMpa: 69, maxMpa: 207 } as const;

type FieldErrors = Record<string, string[] | undefined>;

const FIELDS: readonly { key: keyof JointGasket; field: string; quantity: Quantity; what: string }[] = [
  { key: 'innerMm', field: 'gasketInner', quantity: 'length', what: 'inner contact diameter' },
  { key: 'outerMm', field: 'gasketOuter', quantity: 'length', what: 'outer contact diameter' },
  { key: 'areaMm2', field: 'gasketArea', quantity: 'area', what: 'contact area' },
  { key: 'minSeatingMpa', field: 'gasketMinSeating', quantity: 'stress', what: 'minimum seating stress' },
  { key: 'maxMpa', field: 'gasketMax', quantity: 'stress', what: 'maximum stress' },
  { key: 'clampLengthMm', field: 'clampLength', quantity: 'length', what: 'clamped length' },
];

const sourceSchema = z.string().trim().max(200, { error: 'Keep the source to 200 characters or fewer.' }).transform((v) => (v === '' ? null : v));
const facingSchema = z.union([z.literal(''), z.enum(FLANGE_FACINGS)], { error: 'Choose a flange facing from the list.' }).transform((v) => (v === '' ? null : v));

/** Reads the gasket fields of a submitted joint form (typed in `units`) into SI, with a message per bad field. */
export function parseGasketFields(values: Record<string, string | undefined>, units: UnitSystem): { value: JointGasket; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const value: JointGasket = { ...NO_GASKET_DATA };
  for (const { key, field, quantity, what } of FIELDS) {
    const text = (values[field] ?? '').trim();
    if (text === '') continue;
    const typed = parseNumberText(text);
    if (!Number.isFinite(typed) || typed <= 0) errors[field] = [`Enter the ${what} as a number more than zero, or leave it empty.`];
    else (value as unknown as Record<string, number>)[key] = fromInputUnit(quantity, typed, units);
  }
  const source = sourceSchema.safeParse(values.gasketStressSource ?? '');
  if (source.success) value.stressSource = source.data;
  else errors.gasketStressSource = [source.error.issues[0]?.message ?? 'This value is not valid.'];
  const facing = facingSchema.safeParse(values.flangeFacing ?? '');
  if (facing.success) value.flangeFacing = facing.data;
  else errors.flangeFacing = ['Choose a flange facing from the list.'];

  if ((value.innerMm === null) !== (value.outerMm === null) && !errors.gasketInner && !errors.gasketOuter) {
    errors[value.innerMm === null ? 'gasketInner' : 'gasketOuter'] = ['Enter both contact diameters, or neither (and the area instead).'];
  }
  if (value.innerMm !== null && value.outerMm !== null) {
    try {
      gasketContactArea({ innerMm: value.innerMm, outerMm: value.outerMm });
    } catch (e) {
      if (!isAppError(e)) throw e;
      errors.gasketOuter = [e.message];
    }
  }
  if (value.minSeatingMpa !== null && value.maxMpa !== null && value.maxMpa <= value.minSeatingMpa && !errors.gasketMax) {
    errors.gasketMax = ['The maximum stress must be above the minimum seating stress.'];
  }
  if ((value.minSeatingMpa !== null || value.maxMpa !== null) && value.stressSource === null && !errors.gasketStressSource) {
    errors.gasketStressSource = [`Say where the stress limits come from (the gasket maker's data sheet, your procedure, or "${TRAINING_DEFAULT_SOURCE}").`];
  }
  return { value, errors };
}

/** The contact area, mm², from the diameters (area of an annulus) or as stored; null when neither is known. */
export function gasketAreaOf(g: Pick<JointGasket, 'innerMm' | 'outerMm' | 'areaMm2'>): number | null {
  if (g.innerMm !== null && g.outerMm !== null && g.outerMm > g.innerMm) return gasketContactArea({ innerMm: g.innerMm, outerMm: g.outerMm });
  return g.areaMm2 !== null && g.areaMm2 > 0 ? g.areaMm2 : null;
}

/** A gasket as stress figures need it: contact area (mm²) and stress limits (MPa) with their source. */
export interface GasketForStress {
  areaMm2: number;
  minSeatingMpa: number | null;
  maxMpa: number | null;
  source: string | null;
}

/** The gasket's contact area and limits, or null when its contact area is not known. */
export function gasketForStress(g: JointGasket): GasketForStress | null {
  const areaMm2 = gasketAreaOf(g);
  return areaMm2 === null ? null : { areaMm2, minSeatingMpa: g.minSeatingMpa, maxMpa: g.maxMpa, source: g.stressSource };
}

export const gasketLimitsOf = (g: Pick<JointGasket, 'minSeatingMpa' | 'maxMpa'>): GasketLimits => ({ minSeatingMpa: g.minSeatingMpa, maxMpa: g.maxMpa });

/** The form's text for stored gasket data in `units` (a new joint starts from the training defaults). */
export function gasketFormValues(g: JointGasket | null, units: UnitSystem): Record<string, string> {
  const start: JointGasket = g ?? { ...NO_GASKET_DATA, ...GASKET_TRAINING_DEFAULTS, stressSource: TRAINING_DEFAULT_SOURCE, flangeFacing: 'Raised face' };
  const out: Record<string, string> = { gasketStressSource: start.stressSource ?? '', flangeFacing: start.flangeFacing ?? '' };
  for (const { key, field, quantity } of FIELDS) {
    const v = start[key] as number | null;
    out[field] = v === null ? '' : formatInputValue(toInputUnit(quantity, v, units));
  }
  return out;
}
