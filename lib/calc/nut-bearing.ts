import { inToMm } from './units';

/**
 * Starting values for the nut bearing face, so the long form has numbers before the user measures:
 * - bearing OD ≈ heavy-hex width across flats = 1.5·D + 1/8 in (ASME B18.2.2 heavy hex; from
 *   memory, unverified). For 3/4 in this gives 1.25 in, as in docs/REFERENCE.md §3's worked check.
 * - hole = D + 1/8 in: ASME B16.5 Table 7 bolt holes are 1/8 in larger than the bolts ✓ [B165-T7]
 *   (docs/REFERENCE.md §6).
 * For metric studs the same rule is applied in millimetres (our simplification; metric flanges
 * and nuts have their own tables).
 */
export function estimateNutBearing(diameterMm: number): { bearingOdMm: number; holeDiameterMm: number } {
  const eighth = inToMm(0.125);
  return { bearingOdMm: 1.5 * diameterMm + eighth, holeDiameterMm: diameterMm + eighth };
}
