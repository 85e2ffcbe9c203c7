import { AppError } from '@/lib/http/errors';

/**
 * Hydraulic bolt tensioning: the load the tool must apply so that, after the nut takes the load and
 * some stretch is lost (thread deflection, nut dilation, embedding ✓ [TENS1]), the stud keeps the
 * residual preload wanted. Applied load = residual load × LTF ✓ [FE-LTF] (docs/REFERENCE.md §4).
 */

/**
 * Load transfer factor rules:
 * - `tens1`: LTF = 1.01 + D/L_clamp, not less than 1.15 ✓ [TENS1].
 * - `tens2`: the same expression with a floor of 1.1. docs/REFERENCE.md §4 records only that [TENS2] uses a
 *   floor of 1.1; applying that floor to the 1.01 + D/L expression is our reading.
 */
export type LtfRule = 'tens1' | 'tens2';

export const LTF_RULES: readonly { id: LtfRule; label: string; floor: number; source: string }[] = [
  // tens1 ✓ [TENS1]; tens2: floor ✓ [TENS2], the 1.01 + D/L part is our reading (docs/REFERENCE.md §4).
  { id: 'tens1', label: '1.01 + D/L, at least 1.15', floor: 1.15, source: "a tensioner maker's load transfer rule; check your tool maker's instructions" },
  { id: 'tens2', label: '1.01 + D/L, at least 1.10', floor: 1.1, source: "a lower floor some tool makers use; check your tool maker's instructions" },
];

/**
 * Load transfer factor from stud diameter D and clamped length L (same length unit).
 * @example loadTransferFactor('tens1', 25.4, 100) // 1.264
 * @example loadTransferFactor('tens1', 25.4, 400) // 1.15 (the floor)
 * @throws AppError `invalid_input` for a non-positive diameter or clamped length.
 */
export function loadTransferFactor(rule: LtfRule, diameter: number, clampLength: number): number {
  if (!Number.isFinite(diameter) || diameter <= 0) {
    throw new AppError('invalid_input', 'Stud diameter must be a positive number.', { field: 'diameter' });
  }
  if (!Number.isFinite(clampLength) || clampLength <= 0) {
    throw new AppError('invalid_input', 'Clamped length must be a positive number.', { field: 'clampLength' });
  }
  const r = LTF_RULES.find((x) => x.id === rule);
  if (!r) throw new AppError('invalid_input', `Unknown load transfer factor rule "${rule}".`, { field: 'ltfRule' });
  return Math.max(r.floor, 1.01 + diameter / clampLength);
}

/**
 * Load (N) the tensioner must apply for a residual preload (N): F_applied = F_residual × LTF.
 * @throws AppError `invalid_input` for a non-positive load or an LTF below 1.
 */
export function appliedTensionerLoad(residualN: number, ltf: number): number {
  if (!Number.isFinite(residualN) || residualN <= 0) {
    throw new AppError('invalid_input', 'Residual preload must be a positive number.', { field: 'preload' });
  }
  if (!Number.isFinite(ltf) || ltf < 1) {
    throw new AppError('invalid_input', 'Load transfer factor must be 1 or more.', { field: 'ltf' });
  }
  return residualN * ltf;
}

/**
 * Hydraulic pressure (MPa) to develop a load (N) on a tool of total piston (hydraulic) area (mm²):
 * p = F / A (common practice; the tool maker's own pressure chart governs).
 * @throws AppError `invalid_input` for a non-positive piston area.
 */
export function tensionerPressureMpa(appliedN: number, pistonAreaMm2: number): number {
  if (!Number.isFinite(pistonAreaMm2) || pistonAreaMm2 <= 0) {
    throw new AppError('invalid_input', 'Piston area must be a positive number.', { field: 'pistonArea' });
  }
  return appliedN / pistonAreaMm2;
}
