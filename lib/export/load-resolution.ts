/**
 * Loads in CSV exports carry what a load instrument resolves, not the 14 significant digits of a
 * floating-point mean or a unit conversion: 0.01 kN (10 N) in SI, 1 lbf in US units (common
 * practice for the displays of load-cell and ultrasonic bolt-load readers on studs of this size).
 * The JSON exports keep full precision for analysis. Pure and browser-safe.
 */
import { NEWTONS_PER_LBF } from '@/lib/ingest/units';

/** The step a CSV load is written to: 10 N (0.01 kN) or 1 lbf. */
export const CSV_LOAD_RESOLUTION = { si: 10, us: 1 } as const;

/** A load in newtons as the CSV cell of the unit system: newtons to the nearest 10 N, or pound-force to the nearest 1 lbf. */
export function csvLoad(loadN: number, units: 'si' | 'us'): number {
  const value = units === 'us' ? loadN / NEWTONS_PER_LBF : loadN;
  const step = CSV_LOAD_RESOLUTION[units];
  const rounded = Math.round(value / step) * step;
  return rounded === 0 ? 0 : rounded; // no "-0" cell
}
