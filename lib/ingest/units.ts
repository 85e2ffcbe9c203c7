/**
 * Unit conversions for imported logger files. Loads are stored in newtons and torques in N·m
 * (see `NormalisedRun`); everything else is converted here, at the edge.
 *
 * Sources:
 * - 1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N, exact by definition (from memory:
 *   the international pound of 1959 and standard gravity of the 3rd CGPM, 1901; product computed).
 * - 1 ft = 0.3048 m exactly (from memory, same 1959 agreement), so 1 ft-lb (ft·lbf) =
 *   0.3048 × 4.4482216152605 = 1.3558179483314004 N·m (computed).
 * - Strain-gauged studs: load = E·ε·A at the gauged section (docs/REFERENCE.md §2, common practice),
 *   times a per-position calibration factor from the joint's calibration (common practice).
 */
import { AppError } from '@/lib/http/errors';

/** Load units a logger file may use. `microstrain` needs E, stress area and calibration. */
import { N_PER_LBF, NM_PER_FTLB } from '../calc/units';

export const LOAD_UNITS = ['N', 'kN', 'lbf', 'kip', 'microstrain'] as const;
/** A load unit a logger file may use. */
export type LoadUnit = (typeof LOAD_UNITS)[number];

/** Torque units a logger file may use. */
export const TORQUE_UNITS = ['N·m', 'ft-lb'] as const;
/** A torque unit a logger file may use. */
export type TorqueUnit = (typeof TORQUE_UNITS)[number];

/** Newtons in one pound-force, exact by definition (the app's one constant, lib/calc/units.ts). */
export const NEWTONS_PER_LBF = N_PER_LBF;
/** Newtons in one kip (1000 lbf). */
export const NEWTONS_PER_KIP = 1000 * NEWTONS_PER_LBF;
/** N·m in one foot-pound (ft·lbf), computed from the exact foot and pound-force (lib/calc/units.ts). */
export const NM_PER_FT_LB = NM_PER_FTLB;

/** What microstrain conversion needs: the caller's E, stress area and the position's factor. */
export interface StrainConversion {
  /** Young's modulus of the stud material at the gauged section, in Pa (e.g. 200e9 for steel). */
  youngsModulusPa: number;
  /** Cross-section area at the gauge, in m² (commonly the thread tensile stress area). */
  stressAreaM2: number;
  /** Calibration factor of the gauged stud at this position (1 = nominal). */
  calibrationFactor?: number;
}

function checkStrain(strain: StrainConversion | undefined): Required<StrainConversion> {
  if (!strain) {
    throw new AppError('invalid_input', 'Microstrain loads need the joint\'s Young\'s modulus and stress area.', {
      field: 'youngsModulusPa',
    });
  }
  const { youngsModulusPa, stressAreaM2 } = strain;
  const calibrationFactor = strain.calibrationFactor ?? 1;
  if (!(Number.isFinite(youngsModulusPa) && youngsModulusPa > 0)) {
    throw new AppError('invalid_input', `Young's modulus must be a positive number of Pa, got ${youngsModulusPa}.`, {
      field: 'youngsModulusPa',
    });
  }
  if (!(Number.isFinite(stressAreaM2) && stressAreaM2 > 0)) {
    throw new AppError('invalid_input', `Stress area must be a positive number of m², got ${stressAreaM2}.`, {
      field: 'stressAreaM2',
    });
  }
  if (!(Number.isFinite(calibrationFactor) && calibrationFactor > 0)) {
    throw new AppError('invalid_input', `Calibration factor must be a positive number, got ${calibrationFactor}.`, {
      field: 'calibration',
    });
  }
  return { youngsModulusPa, stressAreaM2, calibrationFactor };
}

/**
 * Stud load in N from a gauge reading in microstrain: F = E · (µε × 10⁻⁶) · A · calibration
 * (docs/REFERENCE.md §2; common practice). 1000 µε at 200 GPa on 245 mm² gives 200 MPa × 245 mm² = 49 kN.
 *
 * @throws AppError('invalid_input') when E, area or the factor is not a positive number.
 * @example microstrainToN(1000, { youngsModulusPa: 200e9, stressAreaM2: 245e-6 }) // 49000
 */
export function microstrainToN(microstrain: number, strain: StrainConversion): number {
  const s = checkStrain(strain);
  return s.youngsModulusPa * microstrain * 1e-6 * s.stressAreaM2 * s.calibrationFactor;
}

/** Inverse of {@link microstrainToN}: the gauge reading in µε that the load in N corresponds to. */
export function nToMicrostrain(loadN: number, strain: StrainConversion): number {
  const s = checkStrain(strain);
  return loadN / (s.youngsModulusPa * 1e-6 * s.stressAreaM2 * s.calibrationFactor);
}

/**
 * Converts a load in `unit` to newtons. `strain` is required for `microstrain` and ignored
 * otherwise (loads already in force units are taken as calibrated by the logger).
 *
 * @throws AppError('invalid_input') for microstrain without a valid {@link StrainConversion}.
 * @example loadToN(2, 'kip') // 8896.443230521
 */
export function loadToN(value: number, unit: LoadUnit, strain?: StrainConversion): number {
  switch (unit) {
    case 'N':
      return value;
    case 'kN':
      return value * 1000;
    case 'lbf':
      return value * NEWTONS_PER_LBF;
    case 'kip':
      return value * NEWTONS_PER_KIP;
    case 'microstrain':
      return microstrainToN(value, checkStrain(strain));
  }
}

/** Converts a load in newtons to `unit`; the inverse of {@link loadToN}. */
export function nToLoad(valueN: number, unit: LoadUnit, strain?: StrainConversion): number {
  switch (unit) {
    case 'N':
      return valueN;
    case 'kN':
      return valueN / 1000;
    case 'lbf':
      return valueN / NEWTONS_PER_LBF;
    case 'kip':
      return valueN / NEWTONS_PER_KIP;
    case 'microstrain':
      return nToMicrostrain(valueN, checkStrain(strain));
  }
}

/** Converts a torque in `unit` to N·m. @example torqueToNm(100, 'ft-lb') // 135.58179483314004 */
export function torqueToNm(value: number, unit: TorqueUnit): number {
  return unit === 'ft-lb' ? value * NM_PER_FT_LB : value;
}

/** Converts a torque in N·m to `unit`; the inverse of {@link torqueToNm}. */
export function nmToTorque(valueNm: number, unit: TorqueUnit): number {
  return unit === 'ft-lb' ? valueNm / NM_PER_FT_LB : valueNm;
}
