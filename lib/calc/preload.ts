import { AppError } from '@/lib/http/errors';
import type { CalcWarning } from './warnings';
import { formatDecimals } from './units';

/**
 * Target preload and stud stress utilisation.
 *
 * F = σ · As (force = stress × tensile stress area): with σ in MPa (N/mm²) and As in mm², F is in
 * N. This is the definition of average axial stress over the stress area (common practice; the
 * stress area is the area ISO 898-1 and ASME B1.1 define for this use, docs/REFERENCE.md §1).
 */

function requirePositive(value: number, what: string, field: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new AppError('invalid_input', `${what} must be a positive number.`, { field });
  }
}

/**
 * Preload (N) that gives the stress `stressMpa` over the area `areaMm2`: F = σ·As.
 * @example preloadFromStress(ksiToMpa(52.5), in2ToMm2(0.334)) // ≈ 78.0 kN = 17,535 lbf (docs/REFERENCE.md §3)
 * @throws AppError `invalid_input` for a non-positive stress or area.
 */
export function preloadFromStress(stressMpa: number, areaMm2: number): number {
  requirePositive(stressMpa, 'Target stress', 'targetStress');
  requirePositive(areaMm2, 'Stress area', 'area');
  return stressMpa * areaMm2;
}

/**
 * Preload (N) at `percent` % of the yield strength `yieldMpa` over `areaMm2`: F = (p/100)·Sy·As.
 * @throws AppError `invalid_input` for a non-positive percent, yield or area.
 */
export function preloadFromPercentOfYield(percent: number, yieldMpa: number, areaMm2: number): number {
  requirePositive(percent, 'Percent of yield', 'targetPercent');
  requirePositive(yieldMpa, 'Yield strength', 'yield');
  return preloadFromStress((percent / 100) * yieldMpa, areaMm2);
}

/** Average stress (MPa) of a load `forceN` over `areaMm2`. */
export function stressFromPreload(forceN: number, areaMm2: number): number {
  requirePositive(areaMm2, 'Stress area', 'area');
  return forceN / areaMm2;
}

/** Percent of yield a load reaches: 100 · F / (As · Sy). */
export function percentOfYield(forceN: number, areaMm2: number, yieldMpa: number): number {
  requirePositive(yieldMpa, 'Yield strength', 'yield');
  return (100 * stressFromPreload(forceN, areaMm2)) / yieldMpa;
}

/** Thresholds used by `preloadWarnings`, in % of yield, with sources. */
export const PRELOAD_THRESHOLDS = {
  /** Lower end of the commonly quoted range (from memory, unverified; docs/REFERENCE.md §4). */
  usualLow: 40,
  /** Upper end of the commonly quoted range (from memory, unverified; docs/REFERENCE.md §4). */
  usualHigh: 70,
  /** One tensioner maker's note: consider fatigue above 75 % of yield ✓ [TENS1] (docs/REFERENCE.md §4). */
  tensionerFatigue: 75,
  /** Same note: never exceed 95 % of yield at the applied load ✓ [TENS1] (docs/REFERENCE.md §4). */
  tensionerMax: 95,
  /** Yield itself. */
  yield: 100,
} as const;

/**
 * The hint beside a target in % of yield, on the calculator and the joint form. Engineer notes
 * (docs/REFERENCE.md §4): about 50 % is a rule of thumb ✓ [ENGTIPS] and PCC-1's "typically 50 %"
 * ✓ [RODERY]; PCC-1-2013 Table 1 assumes 50 ksi on the root area ✓ [PCC1-T1]; the 40–70 % range is
 * from memory, unverified, so the screen offers it as a default to set.
 */
export const TARGET_PERCENT_HINT =
  'About 50 % of yield is a usual starting point (ASME PCC-1-2013, Table 1 assumes 50 ksi on the root area); 40–70 % is a training default: set your own.';

/** What the screen names as the source of the 40–70 % range: a default each centre sets for itself. */
const TARGET_RANGE_SOURCE = 'training default: set your own (ASME PCC-1, Appendix O gives a method)';
/** What the screen names for the tensioner limits: one tool maker's note, so the user's own tool's data. */
const TENSIONER_MAKER = "the tensioner maker's instructions";

/**
 * Warnings for a residual (in-service) preload and, for hydraulic tensioning, the load the tool
 * applies before load transfer, both in % of yield.
 *
 * - residual < 40 % or > 70 %: `caution`, outside the commonly quoted 40–70 % range (from memory,
 *   unverified, docs/REFERENCE.md §4).
 * - applied > 75 %: `caution`, fatigue to be considered ✓ [TENS1].
 * - applied > 95 %: `danger`, above the tool maker's 95 % limit ✓ [TENS1].
 * - residual or applied ≥ 100 %: `danger`, the stud is over-stressed (past minimum yield).
 */
export function preloadWarnings(input: { residualPercentOfYield: number; appliedPercentOfYield?: number }): CalcWarning[] {
  const t = PRELOAD_THRESHOLDS;
  const out: CalcWarning[] = [];
  const r = input.residualPercentOfYield;
  const a = input.appliedPercentOfYield;
  if (r >= t.yield) {
    out.push({
      code: 'over-stress',
      severity: 'danger',
      message: `The target preload is ${formatDecimals(r, 0)} % of yield: the stud would be over-stressed past its minimum yield strength.`,
      source: 'definition of minimum yield strength (common practice)',
    });
  } else if (r > t.usualHigh) {
    out.push({
      code: 'above-usual-range',
      severity: 'caution',
      // The 40–70 % range is from memory, unverified (docs/REFERENCE.md §4).
      message: `The target preload is ${formatDecimals(r, 0)} % of yield, above the 40–70 % range this calculator uses as its training default.`,
      source: TARGET_RANGE_SOURCE,
    });
  } else if (r < t.usualLow) {
    out.push({
      code: 'below-usual-range',
      severity: 'caution',
      message: `The target preload is ${formatDecimals(r, 0)} % of yield, below the 40–70 % range this calculator uses as its training default; check it seals the gasket.`,
      source: TARGET_RANGE_SOURCE,
    });
  }
  if (a !== undefined && Number.isFinite(a)) {
    if (a >= t.yield) {
      out.push({
        code: 'applied-over-stress',
        severity: 'danger',
        message: `The tensioner load is ${formatDecimals(a, 0)} % of yield: the stud would be stretched past its minimum yield strength before the nut takes the load.`,
        source: 'definition of minimum yield strength (common practice)',
      });
    } else if (a > t.tensionerMax) {
      out.push({
        code: 'applied-above-95',
        severity: 'danger',
        message: `The tensioner load is ${formatDecimals(a, 0)} % of yield; one tool maker says never to exceed 95 % of yield at the applied load.`,
        // ✓ [TENS1] (docs/REFERENCE.md §4)
        source: TENSIONER_MAKER,
      });
    } else if (a > t.tensionerFatigue) {
      out.push({
        code: 'applied-above-75',
        severity: 'caution',
        message: `The tensioner load is ${formatDecimals(a, 0)} % of yield; one tool maker advises considering fatigue above 75 %.`,
        // ✓ [TENS1] (docs/REFERENCE.md §4)
        source: TENSIONER_MAKER,
      });
    }
  }
  return out;
}
