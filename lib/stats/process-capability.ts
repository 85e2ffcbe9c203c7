import { StatsError } from './stats-error';
import { assertNumber } from './internal/assert-number';
import { assertValues } from './internal/assert-values';
import { mean } from './mean';
import { sampleStandardDeviation } from './sample-standard-deviation';

/** Result of {@link processCapability}. */
export interface ProcessCapabilityResult {
  /** (USL − LSL)/(6s); null when s = 0 (capability undefined). */
  cp: number | null;
  /** min(USL − x̄, x̄ − LSL)/(3s); null when s = 0. */
  cpk: number | null;
  lowerLimit: number;
  upperLimit: number;
  mean: number;
  sd: number;
  n: number;
}

/**
 * Capability indices of final loads against the band target ± band %: Cp (how the band compares
 * with the spread, ignoring centring) and Cpk (also penalises an off-centre mean).
 *
 * Algorithm: LSL = target(1 − band/100), USL = target(1 + band/100); s is the overall sample SD
 * (corrected two-pass), x̄ the refined mean; Cp = (USL − LSL)/6s, Cpk = min(USL − x̄, x̄ − LSL)/3s.
 * With one run's studs the sample is small, so read these as descriptive, not as a process claim.
 *
 * References: NIST/SEMATECH e-Handbook §6.1.6 (process capability, Cp and Cpk).
 *
 * @throws {StatsError} fewer than two values, non-finite values, `processCapability requires a positive target`,
 *   `processCapability requires a positive bandPercent (got 0)`.
 * @example
 * processCapability([90, 100, 110], { target: 100, bandPercent: 30 }).cp; // 1 (s = 10, band 70..130)
 */
export function processCapability(
  values: readonly number[],
  options: { target: number; bandPercent: number },
): ProcessCapabilityResult {
  assertValues('processCapability', values, 2);
  assertNumber('processCapability', 'target', options.target, 'positive');
  assertNumber('processCapability', 'bandPercent', options.bandPercent, 'positive');
  if (options.bandPercent >= 100) {
    throw new StatsError(`processCapability requires a bandPercent below 100 (got ${options.bandPercent})`);
  }
  const lowerLimit = options.target * (1 - options.bandPercent / 100);
  const upperLimit = options.target * (1 + options.bandPercent / 100);
  const m = mean(values);
  const sd = sampleStandardDeviation(values);
  const cp = sd === 0 ? null : (upperLimit - lowerLimit) / (6 * sd);
  const cpk = sd === 0 ? null : Math.min(upperLimit - m, m - lowerLimit) / (3 * sd);
  return { cp, cpk, lowerLimit, upperLimit, mean: m, sd, n: values.length };
}
