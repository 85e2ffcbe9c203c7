import { calibrationFactor, hysteresisError, linearityError } from '@/lib/stats';
import { formatDecimals } from '@/lib/calc/units';
import type { CalibrationLevels } from './calibration-table';
import type { CalibrationLimits } from './calibration-limits';

/** The factor range a joint position accepts (the joint form's own range). */
export const FACTOR_RANGE = { min: 0.5, max: 1.5 } as const;

export interface PositionAssessment {
  position: number;
  factor: number;
  lower: number;
  upper: number;
  linearityPercent: number;
  hysteresisPercent: number;
  zeroReturnPercent: number;
  accepted: boolean;
  /** Why it was refused, in words for the screen (empty when accepted). */
  refusals: string[];
  /** The new factor lies outside the previous accepted interval of this position. */
  drift: boolean;
}

/**
 * One position's calibration: the factor through the origin with its 95 % interval, linearity,
 * hysteresis and zero return (each as % of full scale), judged against the centre's limits, and
 * drift against the position's previous accepted interval (null when there is none).
 */
export function assessPosition(
  levels: CalibrationLevels,
  positionIndex: number,
  limits: CalibrationLimits,
  previous: { lower: number; upper: number } | null,
): PositionAssessment {
  const reference = levels.loaded.map((r) => r.loadCellKn);
  const indicated = levels.loaded.map((r) => r.gaugeKn[positionIndex]!);
  const fit = calibrationFactor(reference, indicated);
  const linearityPercent = linearityError(reference, indicated, fit.factor, levels.fullScaleKn);
  const hysteresisPercent = hysteresisError(
    levels.pairs.map(({ up, down }) => ({
      loadingReference: up.loadCellKn,
      loadingIndicated: up.gaugeKn[positionIndex]!,
      unloadingReference: down.loadCellKn,
      unloadingIndicated: down.gaugeKn[positionIndex]!,
    })),
    fit.factor,
    levels.fullScaleKn,
  );
  const zero = levels.zero;
  const zeroReturnPercent = (Math.abs(fit.factor * zero.gaugeKn[positionIndex]! - zero.loadCellKn) / levels.fullScaleKn) * 100;
  const halfWidthPercent = ((fit.upper - fit.factor) / Math.abs(fit.factor)) * 100;
  const refusals: string[] = [];
  if (fit.factor < FACTOR_RANGE.min || fit.factor > FACTOR_RANGE.max) refusals.push(`factor outside ${FACTOR_RANGE.min}–${FACTOR_RANGE.max}`);
  if (halfWidthPercent > limits.intervalPercent) refusals.push(`interval ±${round(halfWidthPercent)} % over ${limits.intervalPercent} %`);
  if (linearityPercent > limits.linearityPercent) refusals.push(`linearity ${round(linearityPercent)} % over ${limits.linearityPercent} %`);
  if (hysteresisPercent > limits.hysteresisPercent) refusals.push(`hysteresis ${round(hysteresisPercent)} % over ${limits.hysteresisPercent} %`);
  if (zeroReturnPercent > limits.zeroReturnPercent) refusals.push(`zero return ${round(zeroReturnPercent)} % over ${limits.zeroReturnPercent} %`);
  return {
    position: positionIndex + 1,
    factor: fit.factor,
    lower: fit.lower,
    upper: fit.upper,
    linearityPercent,
    hysteresisPercent,
    zeroReturnPercent,
    accepted: refusals.length === 0,
    refusals,
    drift: previous !== null && (fit.factor < previous.lower || fit.factor > previous.upper),
  };
}

const round = (v: number) => formatDecimals(v, 2, 0);
