/**
 * Typical nut factors (K) by lubricant or finish, as docs/REFERENCE.md §3 tabulates them.
 * K is an empirical lumped factor, not a friction coefficient ✓ [ZIP]; measured mean K across
 * lubricants spans 0.086–0.52 ✓ [HBJ]. These are starting points for training, not values for a
 * real joint: the approved procedure's K, or K found by test on the real joint, governs.
 *
 * `source` is what the screen shows (a book or standard a practitioner can look up, or "training
 * default: set your own"). How far each value was checked (docs/REFERENCE.md §3 and §10):
 * unknown, black, zinc, oil 0.18, cadmium 0.16, anti-seize 0.12 ✓ [SHIG]; dry 0.18–0.27, oil
 * 0.10–0.26, cadmium 0.15–0.19 ✓ [ZIP]; copper/nickel anti-seize and MoS₂ from memory, unverified;
 * PTFE implied by PCC-1-2013 Table 1 (computed). K for a quoted range is its midpoint (computed).
 */
export interface NutFactorSuggestion {
  id: string;
  /** The condition in plain words. */
  label: string;
  /** The K the calculator fills in. For a quoted range, the midpoint. */
  k: number;
  /** What the source quotes, e.g. `"0.18–0.27"`. */
  quoted: string;
  /** Where a practitioner can look the value up, shown on screen. */
  source: string;
}

const SHIGLEY = 'Shigley & Mischke, Mechanical Engineering Design, §8-8';
const SUPPLIER_DATA = "fastener suppliers' published torque–tension data";
const SET_YOUR_OWN = "training default: set your own from the lubricant maker's data";

export const NUT_FACTOR_SUGGESTIONS: readonly NutFactorSuggestion[] = [
  { id: 'unknown', label: 'Condition unknown', k: 0.2, quoted: '0.20', source: SHIGLEY },
  { id: 'black', label: 'Non-plated, black finish', k: 0.3, quoted: '0.30', source: SHIGLEY },
  { id: 'zinc', label: 'Zinc-plated', k: 0.2, quoted: '0.20', source: SHIGLEY },
  { id: 'dry', label: 'Dry steel on steel', k: 0.225, quoted: '0.18–0.27', source: `${SUPPLIER_DATA}; 0.225 is the midpoint` },
  { id: 'oil', label: 'Oiled ("lubricated")', k: 0.18, quoted: '0.18; 0.10–0.26', source: `${SHIGLEY}; ${SUPPLIER_DATA}` },
  { id: 'cadmium', label: 'Cadmium-plated', k: 0.16, quoted: '0.16; 0.15–0.19', source: `${SHIGLEY}; ${SUPPLIER_DATA}` },
  { id: 'anti-seize', label: 'Anti-seize (generic)', k: 0.12, quoted: '0.12', source: SHIGLEY },
  { id: 'cu-ni-anti-seize', label: 'Copper- or nickel-based anti-seize on B7', k: 0.155, quoted: '≈0.13–0.18', source: SET_YOUR_OWN },
  { id: 'mos2', label: 'MoS₂ paste', k: 0.12, quoted: '≈0.10–0.14', source: SET_YOUR_OWN },
  { id: 'ptfe', label: 'PTFE / fluoropolymer-coated B7', k: 0.17, quoted: '≈0.17', source: 'implied by ASME PCC-1-2013, Table 1' },
];

/** Measured mean K across lubricants ✓ [HBJ] (docs/REFERENCE.md §3); outside it the calculator cautions. */
export const MEASURED_K_RANGE = { min: 0.086, max: 0.52, source: 'Handbook of Bolts and Bolted Joints, ch. 19' } as const;
