import { StatsError } from './stats-error';

/** One load level met on the way up and again on the way down. */
export interface HysteresisLevel {
  loadingReference: number;
  loadingIndicated: number;
  unloadingReference: number;
  unloadingIndicated: number;
}

/**
 * Hysteresis of a calibrated gauge: at each level, the difference between the calibrated reading
 * on the way down and on the way up, each taken against its own reference load (so a level the load
 * cell did not hit exactly twice still compares like with like):
 * |(k·x_down − y_down) − (k·x_up − y_up)|; the largest over the levels, as a percentage of full scale.
 * When the reference loads are equal this is k·|x_down − x_up|.
 *
 * Algorithm: one pass over the levels.
 *
 * References: ISO 376:2011 §7 (reversibility error: decreasing minus increasing reading at the same
 * force); expressing as % of full scale is common practice for strain-gauge load instruments.
 *
 * @throws {StatsError} `hysteresisError requires at least one level`, `hysteresisError requires a
 *   positive full scale (got 0)`, non-finite values.
 * @example
 * hysteresisError([{ loadingReference: 50, loadingIndicated: 49.5, unloadingReference: 50, unloadingIndicated: 50.5 }], 1, 100); // 1
 */
export function hysteresisError(levels: readonly HysteresisLevel[], factor: number, fullScale: number): number {
  if (levels.length === 0) throw new StatsError('hysteresisError requires at least one level');
  if (!(fullScale > 0) || !Number.isFinite(fullScale)) throw new StatsError(`hysteresisError requires a positive full scale (got ${fullScale})`);
  if (!Number.isFinite(factor)) throw new StatsError(`hysteresisError requires a finite factor (got ${factor})`);
  let largest = 0;
  levels.forEach((level, i) => {
    const values = [level.loadingReference, level.loadingIndicated, level.unloadingReference, level.unloadingIndicated];
    if (values.some((v) => !Number.isFinite(v))) throw new StatsError(`hysteresisError requires finite values (got ${values.find((v) => !Number.isFinite(v))} at level ${i})`);
    const up = factor * level.loadingIndicated - level.loadingReference;
    const down = factor * level.unloadingIndicated - level.unloadingReference;
    largest = Math.max(largest, Math.abs(down - up));
  });
  return (largest / fullScale) * 100;
}
