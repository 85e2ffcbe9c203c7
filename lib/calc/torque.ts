import { AppError } from '@/lib/http/errors';

/**
 * Torque–tension relations for a stud and nut.
 *
 * Short form: T = K·D·F ✓ [SPR] (docs/REFERENCE.md §3), K the nut factor — an empirical lumped factor,
 * not a friction coefficient ✓ [ZIP]. In SI, T [N·m] = K · D [m] · F [N]. In US units,
 * T [ft-lb] = K · D [in] · F [lbf] / 12 (common practice).
 *
 * Long form (Motosh / ISO 16047 / VDI 2230): T = F·[P/(2π) + µt·d2/(2 cos 30°) + µb·Db/2], the
 * pitch (stretch) term, thread friction at the pitch diameter d2 and nut-face friction at the mean
 * bearing diameter Db ≈ (bearing OD + hole)/2. VDI 2230 eq. R13/1 writes it as
 * MA = FM(0.16P + 0.58·d2·µG + µK·DKm/2) ✓ [VDI-CODE]; the Db estimate is ✓ [TRIB2]; the ISO 16047
 * wording is from memory, unverified (docs/REFERENCE.md §3). 30° is the flank half-angle of a 60° thread.
 */

function requirePositive(value: number, what: string, field: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new AppError('invalid_input', `${what} must be a positive number.`, { field });
  }
}
function requireNonNegative(value: number, what: string, field: string): void {
  if (!Number.isFinite(value) || value < 0) {
    throw new AppError('invalid_input', `${what} must be zero or more.`, { field });
  }
}

/**
 * Short-form torque in N·m: T = K·D·F with D in mm (divided by 1000 to metres) and F in N.
 * @throws AppError `invalid_input` for a non-positive K, D or F.
 */
export function shortFormTorqueNm(nutFactor: number, diameterMm: number, forceN: number): number {
  requirePositive(nutFactor, 'Nut factor (K)', 'nutFactor');
  requirePositive(diameterMm, 'Stud diameter', 'diameter');
  requirePositive(forceN, 'Preload', 'preload');
  return (nutFactor * diameterMm * forceN) / 1000;
}

/**
 * Short-form torque in ft-lb from US inputs: T = K·D[in]·F[lbf]/12 (common practice).
 * @example shortFormTorqueFtLb(0.2, 0.75, 17_535) // 219.2 ft-lb (docs/REFERENCE.md §3 worked check ≈219)
 */
export function shortFormTorqueFtLb(nutFactor: number, diameterIn: number, forceLbf: number): number {
  requirePositive(nutFactor, 'Nut factor (K)', 'nutFactor');
  requirePositive(diameterIn, 'Stud diameter', 'diameter');
  requirePositive(forceLbf, 'Preload', 'preload');
  return (nutFactor * diameterIn * forceLbf) / 12;
}

/** Inverse of the short form: preload (N) from torque (N·m), F = T/(K·D). */
export function preloadFromShortFormTorque(torqueNm: number, nutFactor: number, diameterMm: number): number {
  requirePositive(torqueNm, 'Torque', 'torque');
  requirePositive(nutFactor, 'Nut factor (K)', 'nutFactor');
  requirePositive(diameterMm, 'Stud diameter', 'diameter');
  return (torqueNm * 1000) / (nutFactor * diameterMm);
}

/** Inputs of the long form; all lengths in mm (any one consistent length unit works for `equivalentNutFactor`). */
export interface LongFormInputs {
  /** Pitch P. */
  pitchMm: number;
  /** Basic pitch diameter d2. */
  pitchDiameterMm: number;
  /** Thread friction coefficient µt (VDI 2230 µG). */
  muThread: number;
  /** Nut-face (bearing) friction coefficient µb (VDI 2230 µK). */
  muBearing: number;
  /** Mean bearing diameter Db (VDI 2230 DKm); see `meanBearingDiameter`. */
  bearingDiameterMm: number;
}

/** The long form's lever arm, split into its three terms (mm): torque per unit preload. */
export interface LongFormArm {
  pitchMm: number;
  threadMm: number;
  bearingMm: number;
  totalMm: number;
}

/**
 * Mean bearing diameter Db ≈ (bearing OD + hole diameter)/2 ✓ [TRIB2] (docs/REFERENCE.md §3). For a hex
 * nut the bearing OD is often taken as the width across flats (as in docs/REFERENCE.md §3's worked check).
 * @throws AppError `invalid_input` when the hole is not smaller than the bearing OD.
 */
export function meanBearingDiameter(bearingOd: number, holeDiameter: number): number {
  requirePositive(bearingOd, 'Bearing outside diameter', 'bearingOd');
  requirePositive(holeDiameter, 'Hole diameter', 'holeDiameter');
  if (holeDiameter >= bearingOd) {
    throw new AppError('invalid_input', 'The hole must be smaller than the nut bearing face.', { field: 'holeDiameter' });
  }
  return (bearingOd + holeDiameter) / 2;
}

/**
 * The bracket of the long form, P/(2π) + µt·d2/(2 cos 30°) + µb·Db/2, term by term (same length
 * unit as the inputs).
 */
export function longFormArm(i: LongFormInputs): LongFormArm {
  requirePositive(i.pitchMm, 'Pitch', 'pitch');
  requirePositive(i.pitchDiameterMm, 'Pitch diameter', 'pitchDiameter');
  requireNonNegative(i.muThread, 'Thread friction coefficient', 'muThread');
  requireNonNegative(i.muBearing, 'Bearing friction coefficient', 'muBearing');
  requirePositive(i.bearingDiameterMm, 'Mean bearing diameter', 'bearingDiameter');
  const pitch = i.pitchMm / (2 * Math.PI);
  const thread = (i.muThread * i.pitchDiameterMm) / (2 * Math.cos(Math.PI / 6));
  const bearing = (i.muBearing * i.bearingDiameterMm) / 2;
  return { pitchMm: pitch, threadMm: thread, bearingMm: bearing, totalMm: pitch + thread + bearing };
}

/** Long-form torque (N·m) for a preload `forceN` (N): T = F·arm, arm in mm divided by 1000. */
export function longFormTorqueNm(forceN: number, i: LongFormInputs): number {
  requirePositive(forceN, 'Preload', 'preload');
  return (forceN * longFormArm(i).totalMm) / 1000;
}

/** Inverse of the long form: preload (N) from torque (N·m). */
export function preloadFromLongFormTorque(torqueNm: number, i: LongFormInputs): number {
  requirePositive(torqueNm, 'Torque', 'torque');
  return (torqueNm * 1000) / longFormArm(i).totalMm;
}

/**
 * The nut factor K that makes the short form give the long form's torque: K = arm / D
 * = [P/2π + 0.577µt·d2 + 0.5µb·Db]/D (computed, docs/REFERENCE.md §3).
 * @example equivalentNutFactor(19.05, { pitchMm: 2.54, pitchDiameterMm: 17.4, muThread: 0.15, muBearing: 0.15, bearingDiameterMm: 26.99 }) // ≈ 0.21
 */
export function equivalentNutFactor(diameterMm: number, i: LongFormInputs): number {
  requirePositive(diameterMm, 'Stud diameter', 'diameter');
  return longFormArm(i).totalMm / diameterMm;
}
