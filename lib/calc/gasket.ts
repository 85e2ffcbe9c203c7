import { AppError, isAppError } from '@/lib/http/errors';

/**
 * Gasket stress from stud loads, and back (docs/REFERENCE.md §9a, §7).
 *
 * - Contact area of a ring gasket: the area of an annulus, A = π/4 (Do² − Di²) (geometry).
 * - Average gasket stress: σ = total stud load / contact area (stress = force / area; common practice
 *   for a ring gasket inside the bolt circle, docs/REFERENCE.md §9a).
 * - Per-position estimate: each stud presses on its tributary arc of the ring, one n-th of the contact
 *   area, so σ_i = F_i / (A / n) (common practice; it ignores flange bending, which spreads a stud's
 *   load over its neighbours' arcs, so the real spread is smaller than this estimate shows).
 * - The inverse: stud load for a target gasket stress, F = σ · A / n.
 *
 * Units: mm, mm², N, MPa (= N/mm²), as everywhere in lib/calc.
 */

/** A gasket's contact described by its inner and outer contact diameters, or by its area directly. */
export type GasketContact = { innerMm: number; outerMm: number } | { areaMm2: number };

/** The gasket's stress limits, MPa (either may be unknown). */
export interface GasketLimits {
  minSeatingMpa: number | null;
  maxMpa: number | null;
}

const positive = (value: number, field: string, message: string) => {
  if (!Number.isFinite(value) || value <= 0) throw new AppError('invalid_input', message, { field });
};

/**
 * Contact area, mm²: π/4 (Do² − Di²) from the diameters, or the area as given.
 * @example gasketContactArea({ innerMm: 100, outerMm: 150 }) // 9817.48 (= 3125π)
 * @throws AppError `invalid_input` for a non-positive value or an outer diameter not above the inner.
 */
export function gasketContactArea(contact: GasketContact): number {
  if ('areaMm2' in contact) {
    positive(contact.areaMm2, 'gasketArea', 'The gasket contact area must be more than zero.');
    return contact.areaMm2;
  }
  positive(contact.innerMm, 'gasketInner', 'The gasket inner contact diameter must be more than zero.');
  positive(contact.outerMm, 'gasketOuter', 'The gasket outer contact diameter must be more than zero.');
  if (contact.outerMm <= contact.innerMm) {
    throw new AppError('invalid_input', 'The outer contact diameter must be larger than the inner.', { field: 'gasketOuter' });
  }
  return (Math.PI / 4) * (contact.outerMm ** 2 - contact.innerMm ** 2);
}

/**
 * Average gasket stress, MPa: the sum of the stud loads (N) over the contact area (mm²).
 * @throws AppError `invalid_input` for no loads, a non-finite load or a non-positive area.
 */
export function gasketStress(loadsN: readonly number[], areaMm2: number): number {
  positive(areaMm2, 'gasketArea', 'The gasket contact area must be more than zero.');
  if (loadsN.length === 0 || loadsN.some((load) => !Number.isFinite(load))) {
    throw new AppError('invalid_input', 'Every stud needs a load to work out the gasket stress.', { field: 'loads' });
  }
  return loadsN.reduce((sum, load) => sum + load, 0) / areaMm2;
}

/** Per-position estimate, MPa: each stud's load over its tributary arc, one n-th of the contact area. */
export function positionGasketStresses(loadsN: readonly number[], areaMm2: number): number[] {
  gasketStress(loadsN, areaMm2); // the same checks
  const tributary = areaMm2 / loadsN.length;
  return loadsN.map((load) => load / tributary);
}

/**
 * Stud load (N, each stud) that gives a target average gasket stress (MPa): F = σ · A / n.
 * @throws AppError `invalid_input` for a non-positive stress, area or stud count.
 */
export function studLoadForGasketStress(targetMpa: number, areaMm2: number, studCount: number): number {
  positive(targetMpa, 'gasketStress', 'The target gasket stress must be more than zero.');
  positive(areaMm2, 'gasketArea', 'The gasket contact area must be more than zero.');
  if (!Number.isInteger(studCount) || studCount < 1) throw new AppError('invalid_input', 'Enter the number of studs as a whole number.', { field: 'studCount' });
  return (targetMpa * areaMm2) / studCount;
}

/** Where a stress lies against the gasket's limits. */
export type GasketStressLevel = 'below_seating' | 'within' | 'above_max' | 'unknown';

export function gasketStressLevel(stressMpa: number, limits: GasketLimits): GasketStressLevel {
  if (limits.maxMpa !== null && stressMpa > limits.maxMpa) return 'above_max';
  if (limits.minSeatingMpa !== null && stressMpa < limits.minSeatingMpa) return 'below_seating';
  return limits.minSeatingMpa === null && limits.maxMpa === null ? 'unknown' : 'within';
}

export interface GasketStressSummary {
  averageMpa: number;
  positionsMpa: number[];
  /** Positions (1-based) whose estimate is below the minimum seating stress. */
  belowSeating: number[];
  /** Positions (1-based) whose estimate is above the maximum stress. */
  aboveMax: number[];
}

/** Average and per-position gasket stress for one set of stud loads, with the positions outside the limits. */
export function gasketStressSummary(loadsN: readonly number[], areaMm2: number, limits: GasketLimits): GasketStressSummary {
  const positionsMpa = positionGasketStresses(loadsN, areaMm2);
  const where = (level: GasketStressLevel) => positionsMpa.flatMap((s, i) => (gasketStressLevel(s, limits) === level ? [i + 1] : []));
  return { averageMpa: gasketStress(loadsN, areaMm2), positionsMpa, belowSeating: where('below_seating'), aboveMax: where('above_max') };
}

/** The calculator's gasket section: inputs in calculation units; NaN for an empty or unreadable field. */
export interface GasketCalcInputs {
  innerMm: number;
  outerMm: number;
  studCount: number;
  targetStressMpa: number;
  /** The calculator's target preload per stud, N, when it could be worked out. */
  preloadN: number | null;
}

export interface GasketCalcResult {
  errors: Partial<Record<'gasketInner' | 'gasketOuter' | 'gasketStuds' | 'gasketStress', string>>;
  areaMm2?: number;
  /** Stud load (each) for the target gasket stress. */
  studLoadN?: number;
  /** Average gasket stress at the calculator's target preload. */
  stressAtPreloadMpa?: number;
}

const messageOf = (e: unknown): string => {
  if (!isAppError(e)) throw e;
  return e.message;
};

/** Target gasket stress → stud load, and the calculator's preload → gasket stress. Never throws for bad input. */
export function gasketCalculation(input: GasketCalcInputs): GasketCalcResult {
  const result: GasketCalcResult = { errors: {} };
  try {
    result.areaMm2 = gasketContactArea({ innerMm: input.innerMm, outerMm: input.outerMm });
  } catch (e) {
    result.errors[Number.isFinite(input.innerMm) && input.innerMm > 0 ? 'gasketOuter' : 'gasketInner'] = messageOf(e);
  }
  if (!Number.isInteger(input.studCount) || input.studCount < 1) result.errors.gasketStuds = 'Enter the number of studs as a whole number.';
  if (!Number.isFinite(input.targetStressMpa) || input.targetStressMpa <= 0) result.errors.gasketStress = 'The target gasket stress must be more than zero.';
  if (result.areaMm2 === undefined || result.errors.gasketStuds) return result;
  if (!result.errors.gasketStress) result.studLoadN = studLoadForGasketStress(input.targetStressMpa, result.areaMm2, input.studCount);
  if (input.preloadN !== null) result.stressAtPreloadMpa = gasketStress(Array.from({ length: input.studCount }, () => input.preloadN!), result.areaMm2);
  return result;
}
