/**
 * Joints used by the ingest tests. Invented training joints; the numbers behind the limits:
 * - M20 stress area 245 mm² (docs/REFERENCE.md §1, ISO 898-1 table ✓ [ISO898]).
 * - A193M B7 minimum tensile strength 860 MPa (docs/REFERENCE.md §2 ✓ [A193M]).
 * - Minimum tensile load 860 MPa × 245 mm² = 210.7 kN (computed); absurd-load limit 1.2 × that =
 *   252.84 kN (the 1.2 factor is our own choice of margin for a gauge reading, not a standard).
 * - Target 80 kN: a round invented number (about 45 % of the 720 MPa × 245 mm² yield load).
 */
import type { JointForImport } from '@/lib/ingest/normalise';

export const M20_MIN_TENSILE_N = 860e6 * 245e-6;

/** Eight-stud training joint for the bad-file corpus. */
export const CORPUS_JOINT: JointForImport = {
  studCount: 8,
  targetLoadN: 80_000,
  maxStudLoadN: 1.2 * M20_MIN_TENSILE_N,
  maxStudLoadSource: "1.2 × the stud's minimum tensile load of 210.7 kN",
};

/** Four-stud training joint for the good fixtures (small enough to work out by hand). */
export const FOUR_STUD_JOINT: JointForImport = {
  studCount: 4,
  targetLoadN: 80_000,
  maxStudLoadN: 1.2 * M20_MIN_TENSILE_N,
  maxStudLoadSource: "1.2 × the stud's minimum tensile load of 210.7 kN",
};
