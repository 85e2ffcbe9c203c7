import { z } from 'zod';
import { readNumber } from '@/lib/format/parse-number';

/** Limits a centre sets for accepting a gauge calibration (stored settings; admins change them). */
export interface CalibrationLimits {
  /** Largest residual from the fitted line, % of full scale. */
  linearityPercent: number;
  /** Largest loading−unloading difference at a level, % of full scale. */
  hysteresisPercent: number;
  /** Reading left after unloading, % of full scale. */
  zeroReturnPercent: number;
  /** Largest half-width of the factor's 95 % interval, % of the factor. */
  intervalPercent: number;
  /** Months until the next calibration is due. */
  intervalMonths: number;
}

/**
 * Training defaults (shown as "training default: set your own"): round numbers of the order used for
 * strain-gauge load instruments in teaching rigs (common practice), not taken from a standard.
 */
export const TRAINING_DEFAULT_LIMITS: CalibrationLimits = {
  linearityPercent: 1,
  hysteresisPercent: 1.5,
  zeroReturnPercent: 0.5,
  intervalPercent: 1,
  intervalMonths: 12,
};

const percent = (label: string) =>
  z.preprocess(
    (v) => (typeof v === 'string' ? (readNumber(v).kind === 'number' ? (readNumber(v) as { value: number }).value : Number.NaN) : v),
    z.number({ error: `Enter ${label} as a number.` }).gt(0, { error: `${label} must be above 0 %.` }).max(20, { error: `${label} must be at most 20 %.` }),
  );

export const calibrationLimitsSchema = z.object({
  linearityPercent: percent('The linearity limit'),
  hysteresisPercent: percent('The hysteresis limit'),
  zeroReturnPercent: percent('The zero return limit'),
  intervalPercent: percent('The interval limit'),
  intervalMonths: z.coerce.number({ error: 'Enter the months between calibrations as a whole number.' }).int({ error: 'Enter the months between calibrations as a whole number.' }).min(1).max(60),
});
