/**
 * Typical nut factors (K) by lubricant or finish, as REFERENCE §3 tabulates them with sources.
 * K is an empirical lumped factor, not a friction coefficient ✓ [ZIP]; measured mean K across
 * lubricants spans 0.086–0.52 ✓ [HBJ]. These are starting points for training, not values for a
 * real joint: the approved procedure's K, or K found by test on the real joint, governs.
 */
export interface NutFactorSuggestion {
  id: string;
  /** The condition in plain words. */
  label: string;
  /** The K the calculator fills in. For a quoted range, the midpoint (computed). */
  k: number;
  /** What the source quotes, e.g. `"0.18–0.27"`. */
  quoted: string;
  source: string;
}

export const NUT_FACTOR_SUGGESTIONS: readonly NutFactorSuggestion[] = [
  { id: 'unknown', label: 'Condition unknown', k: 0.2, quoted: '0.20', source: 'Shigley & Mischke §8-8, citing Fastener Facts 1985 ✓ [SHIG]' },
  { id: 'black', label: 'Non-plated, black finish', k: 0.3, quoted: '0.30', source: '✓ [SHIG]' },
  { id: 'zinc', label: 'Zinc-plated', k: 0.2, quoted: '0.20', source: '✓ [SHIG]' },
  { id: 'dry', label: 'Dry steel on steel', k: 0.225, quoted: '0.18–0.27', source: '✓ [ZIP]; 0.225 is the midpoint (computed)' },
  { id: 'oil', label: 'Oiled ("lubricated")', k: 0.18, quoted: '0.18 [SHIG]; 0.10–0.26 [ZIP]', source: '✓ [SHIG], [ZIP]' },
  { id: 'cadmium', label: 'Cadmium-plated', k: 0.16, quoted: '0.16 [SHIG]; 0.15–0.19 [ZIP]', source: '✓ [SHIG], [ZIP]' },
  { id: 'anti-seize', label: 'Anti-seize (generic)', k: 0.12, quoted: '0.12', source: '✓ [SHIG]' },
  { id: 'cu-ni-anti-seize', label: 'Copper- or nickel-based anti-seize on B7', k: 0.155, quoted: '≈0.13–0.18', source: 'from memory, unverified; 0.155 is the midpoint (computed)' },
  { id: 'mos2', label: 'MoS₂ paste', k: 0.12, quoted: '≈0.10–0.14', source: 'from memory, unverified; 0.12 is the midpoint (computed)' },
  { id: 'ptfe', label: 'PTFE / fluoropolymer-coated B7', k: 0.17, quoted: '≈0.17', source: 'implied by PCC-1-2013 Table 1 (computed, REFERENCE §3)' },
];

/** Measured mean K across lubricants ✓ [HBJ] (REFERENCE §3); outside it the calculator cautions. */
export const MEASURED_K_RANGE = { min: 0.086, max: 0.52, source: '✓ [HBJ] (REFERENCE §3)' } as const;
