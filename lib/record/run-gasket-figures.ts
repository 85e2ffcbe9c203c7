import { gasketStress } from '../calc/gasket';
import { gasketAreaOf, type JointGasket } from '../joints/gasket-input';

/**
 * The gasket figures stored on each run (`runs.final_gasket_stress_mpa`, `runs.gasket_min_seating_mpa`),
 * so compare can show the mean gasket stress and the share of seated runs without reading readings.
 * The joint's gasket is the one the run was recorded with (its joint version's snapshot), else the
 * joint's current data for versions made before gaskets were snapshotted, as the run report does.
 */
export interface StoredGasketFigures {
  /** Average gasket stress after the final step, MPa: sum of the final stud loads ÷ contact area; null without a contact area. */
  finalGasketStressMpa: number | null;
  /** The joint's minimum seating stress as recorded, MPa; null when unknown or without a contact area. */
  gasketMinSeatingMpa: number | null;
}

export const NO_GASKET_FIGURES: StoredGasketFigures = { finalGasketStressMpa: null, gasketMinSeatingMpa: null };

/** The gasket a run was recorded with: its version's snapshot when that carries one, else the joint's current data. */
export function recordedGasket(snapshotGasket: JointGasket | null | undefined, currentGasket: JointGasket): JointGasket {
  return snapshotGasket ?? currentGasket;
}

/** The stored gasket figures for a run's final loads (N) and its joint's gasket (SI). */
export function storedGasketFigures(finalLoadsN: readonly number[] | null, gasket: JointGasket): StoredGasketFigures {
  const areaMm2 = gasketAreaOf(gasket);
  if (areaMm2 === null || !finalLoadsN || finalLoadsN.length === 0 || finalLoadsN.some((load) => !Number.isFinite(load))) return NO_GASKET_FIGURES;
  return { finalGasketStressMpa: gasketStress(finalLoadsN, areaMm2), gasketMinSeatingMpa: gasket.minSeatingMpa };
}
