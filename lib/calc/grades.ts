import { AppError } from '@/lib/http/errors';
import { formatDecimals, ksiToMpa, mmToIn } from './units';
import { nominalDiameterMm, type ThreadSpec } from './thread';

/**
 * Minimum strength of stud grades, as data, one row per grade and diameter range. `source` is what
 * the screen shows: the standard and table a practitioner can look up. How far each value was
 * checked is noted beside the row, as docs/REFERENCE.md §2 marks it (✓ = checked against the
 * source named in §10; "from memory, unverified" otherwise).
 *
 * Values are kept in the unit the source gives (ksi for ASTM A193, MPa for A193M); MPa for ksi rows
 * is converted with the exact factor in `units.ts` (computed).
 */

export type GradeId = 'A193-B7' | 'A193-B7M' | 'A193-B16' | 'A193-B8-CL1' | 'A193-B8-CL2' | 'A193M-B7';

/** One diameter range of one grade. */
export interface GradeRow {
  grade: GradeId;
  /** Upper end of the range, inclusive, in `rangeUnit` (lower end exclusive = previous row's upper). */
  maxDiameter: number;
  rangeUnit: 'in' | 'mm';
  /** Range as the source writes it, e.g. `"≤ 2-1/2 in"`. */
  rangeLabel: string;
  /** Minimum tensile strength and minimum yield strength (0.2 % offset), in `stressUnit`. */
  tensile: number;
  yield: number;
  stressUnit: 'ksi' | 'MPa';
  /** Where the values can be looked up (standard and table), shown on screen. */
  source: string;
}

/** Display information for a grade. */
export interface GradeInfo {
  id: GradeId;
  label: string;
  note?: string;
}

export const GRADES: readonly GradeInfo[] = [
  { id: 'A193-B7', label: 'ASTM A193 B7 (Cr-Mo, quenched and tempered)' },
  { id: 'A193M-B7', label: 'ASTM A193M B7 (metric)' },
  // B7M for sour service: from memory, unverified (docs/REFERENCE.md §2); the screen names where to look.
  { id: 'A193-B7M', label: 'ASTM A193 B7M', note: 'Often chosen for sour service; see NACE MR0175/ISO 15156 for the hardness limit.' },
  { id: 'A193-B16', label: 'ASTM A193 B16 (Cr-Mo-V)' },
  { id: 'A193-B8-CL1', label: 'ASTM A193 B8/B8M Class 1 (stainless, solution treated)' },
  // Strength varies with size ✓ [BACO] (docs/REFERENCE.md §2).
  { id: 'A193-B8-CL2', label: 'ASTM A193 B8 Class 2 (stainless, strain hardened)', note: 'Strength varies with size (ASTM A193, Table 2).' },
];

const A193_TABLE_2 = 'ASTM A193, Table 2';
const A193M_TABLE_2 = 'ASTM A193M, Table 2';

/**
 * The table. Ranges without an upper limit in docs/REFERENCE.md §2 (B7M, B8 Class 1) are capped at
 * 4 in, the calculator's largest stud: that cap is ours, not the standard's. Engineer notes per row
 * (docs/REFERENCE.md §2 and §10): B7 rows ✓ [NANL], [BACO], MPa converted from ksi (computed);
 * A193M B7 ≤ M64 ✓ [A193M] (the copy consulted is garbled); A193M B7 > M64 from memory, unverified,
 * and the M100 upper end is ours; B7M and B16 ✓ [NANL]; B8 Class 1 and 2 ✓ [BACO]; B7M and B8
 * Class 1 size ranges not stated in those sources.
 */
export const GRADE_TABLE: readonly GradeRow[] = [
  { grade: 'A193-B7', maxDiameter: 2.5, rangeUnit: 'in', rangeLabel: '≤ 2-1/2 in', tensile: 125, yield: 105, stressUnit: 'ksi', source: A193_TABLE_2 },
  { grade: 'A193-B7', maxDiameter: 4, rangeUnit: 'in', rangeLabel: '> 2-1/2 to 4 in', tensile: 115, yield: 95, stressUnit: 'ksi', source: A193_TABLE_2 },
  { grade: 'A193-B7', maxDiameter: 7, rangeUnit: 'in', rangeLabel: '> 4 to 7 in', tensile: 100, yield: 75, stressUnit: 'ksi', source: A193_TABLE_2 },
  { grade: 'A193M-B7', maxDiameter: 64, rangeUnit: 'mm', rangeLabel: '≤ M64', tensile: 860, yield: 720, stressUnit: 'MPa', source: A193M_TABLE_2 },
  { grade: 'A193M-B7', maxDiameter: 100, rangeUnit: 'mm', rangeLabel: '> M64 to M100', tensile: 795, yield: 655, stressUnit: 'MPa', source: A193M_TABLE_2 },
  { grade: 'A193-B7M', maxDiameter: 4, rangeUnit: 'in', rangeLabel: 'all sizes to 4 in', tensile: 100, yield: 80, stressUnit: 'ksi', source: A193_TABLE_2 },
  { grade: 'A193-B16', maxDiameter: 2.5, rangeUnit: 'in', rangeLabel: '≤ 2-1/2 in', tensile: 125, yield: 105, stressUnit: 'ksi', source: A193_TABLE_2 },
  { grade: 'A193-B8-CL1', maxDiameter: 4, rangeUnit: 'in', rangeLabel: 'all sizes to 4 in', tensile: 75, yield: 30, stressUnit: 'ksi', source: A193_TABLE_2 },
  { grade: 'A193-B8-CL2', maxDiameter: 0.75, rangeUnit: 'in', rangeLabel: '≤ 3/4 in', tensile: 125, yield: 100, stressUnit: 'ksi', source: A193_TABLE_2 },
];

/** Strength of a grade at one diameter, in MPa, with the row it came from. */
export interface GradeProperties {
  grade: GradeId;
  label: string;
  rangeLabel: string;
  tensileMpa: number;
  yieldMpa: number;
  /** The values in the unit the source gives them. */
  native: { tensile: number; yield: number; unit: 'ksi' | 'MPa' };
  source: string;
}

/** The display info of a grade. @throws AppError `invalid_input` for an unknown grade. */
export function gradeInfo(grade: GradeId): GradeInfo {
  const info = GRADES.find((g) => g.id === grade);
  if (!info) throw new AppError('invalid_input', `Unknown stud grade "${grade}".`, { field: 'grade' });
  return info;
}

// Diameters converted from mm to inches may miss a boundary by a rounding error (63.5 mm → 2.5 in).
const EDGE = 1e-9;

/**
 * Minimum tensile and yield strength of a grade for a stud of the given nominal diameter (mm).
 * Range ends are inclusive at the top (a 2-1/2 in B7 stud gets 125/105 ksi, a 2.6 in one 115/95).
 * @throws AppError `invalid_input` when the diameter is outside the table for that grade, e.g.
 * "ASTM A193 B8 Class 2 values are tabulated only up to 3/4 in; this stud is 1 in."
 */
export function gradeProperties(grade: GradeId, diameterMm: number): GradeProperties {
  const info = gradeInfo(grade);
  if (!Number.isFinite(diameterMm) || diameterMm <= 0) {
    throw new AppError('invalid_input', 'The stud diameter must be a positive number.', { field: 'diameter' });
  }
  const rows = GRADE_TABLE.filter((r) => r.grade === grade);
  const row = rows.find((r) => {
    const d = r.rangeUnit === 'in' ? mmToIn(diameterMm) : diameterMm;
    return d <= r.maxDiameter * (1 + EDGE);
  });
  if (!row) {
    const last = rows[rows.length - 1];
    const limit = last ? `${last.maxDiameter} ${last.rangeUnit}` : 'no size';
    const size = last?.rangeUnit === 'mm' ? `${formatDecimals(diameterMm, 2, 0)} mm` : `${formatDecimals(mmToIn(diameterMm), 4, 0)} in`;
    throw new AppError(
      'invalid_input',
      `${info.label} values are tabulated only up to ${limit}; this stud is ${size}.`,
      { field: 'grade' },
    );
  }
  const toMpa = (v: number) => (row.stressUnit === 'ksi' ? ksiToMpa(v) : v);
  return {
    grade,
    label: info.label,
    rangeLabel: row.rangeLabel,
    tensileMpa: toMpa(row.tensile),
    yieldMpa: toMpa(row.yield),
    native: { tensile: row.tensile, yield: row.yield, unit: row.stressUnit },
    source: row.source,
  };
}

/** `gradeProperties` for the nominal diameter of a thread spec. */
export function gradePropertiesForThread(grade: GradeId, thread: ThreadSpec): GradeProperties {
  return gradeProperties(grade, nominalDiameterMm(thread));
}
