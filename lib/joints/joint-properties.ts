import { GRADES, gradeProperties, type GradeId } from '@/lib/calc/grades';
import { threadGeometry, type ThreadSpec } from '@/lib/calc/thread';
import { formatDecimals, MM_PER_IN } from '@/lib/calc/units';

/**
 * Facts about a stored joint, worked out in one place: its thread spec, its stud diameter in
 * metres, its stud grade and the largest believable stud load. Pure (no database); every reader of
 * a joint row (record, assessment, classroom, compare, the joint library) goes through here.
 */

/** The thread columns of a joints row: inch → diameter in inches and threads per inch; metric → mm and pitch in mm. */
export interface StoredThread {
  threadSystem: 'inch' | 'metric';
  threadDiameter: number;
  threadPitch: number;
}

/** The columns the load limit needs. */
export interface StoredJointStrength extends StoredThread {
  studGrade: string;
  targetLoadN: number;
}

/** Stored thread columns → the calculator's thread spec. */
export function threadSpecOf(row: StoredThread): ThreadSpec {
  return row.threadSystem === 'inch'
    ? { system: 'inch', diameterIn: row.threadDiameter, threadsPerInch: row.threadPitch }
    : { system: 'metric', diameterMm: row.threadDiameter, pitchMm: row.threadPitch };
}

/** Nominal stud diameter D in m (for T = K·D·F): inches through the exact 25.4 mm of lib/calc/units. */
export function studDiameterM(row: Pick<StoredThread, 'threadSystem' | 'threadDiameter'>): number {
  const mm = row.threadSystem === 'inch' ? row.threadDiameter * MM_PER_IN : row.threadDiameter;
  return mm / 1000;
}

/** Tensile stress area of the studs in m² (lib/calc); null when the stored thread is not a valid one. */
export function tensileStressAreaM2Of(row: StoredThread): number | null {
  try {
    return threadGeometry(threadSpecOf(row)).tensileStressAreaMm2 * 1e-6;
  } catch {
    return null;
  }
}

/**
 * The stored stud grade as a grade id of lib/calc/grades, or null. The one reader of the stored
 * text: new joints store the trade name ("ASTM A193 B7", from {@link gradeStoredName}); the id
 * itself ("A193-B7"), the calculator's labels ("ASTM A193 B8 Class 2 (stainless, strain
 * hardened)") and "CL 2" / "Class 2" spellings are read too. B8 and B8M without a class are read
 * as Class 1, the lower strength of the two (our choice: the load limit and the yield check stay
 * on the safe side); A193M is read only for B7, the one metric grade of the table.
 *
 * @example gradeIdOf('ASTM A193 B8 CL2') // 'A193-B8-CL2'
 */
export function gradeIdOf(stored: string): GradeId | null {
  const direct = GRADES.find((g) => g.id === stored.trim());
  if (direct) return direct.id;
  const s = ` ${stored.toUpperCase().replace(/\(.*?\)/g, ' ').replace(/[^A-Z0-9]+/g, ' ').trim()} `;
  const has = (word: RegExp) => word.test(s);
  if (has(/ A193M /)) return has(/ B7 /) ? 'A193M-B7' : null;
  if (!has(/ A193 /)) return null;
  if (has(/ B7M /)) return 'A193-B7M';
  if (has(/ B16 /)) return 'A193-B16';
  if (has(/ B8M? /)) return has(/ (CLASS|CL) ?2 /) ? 'A193-B8-CL2' : 'A193-B8-CL1';
  if (has(/ B7 /)) return 'A193-B7';
  return null;
}

/** The stud grade as stored: the trade name ("A193-B7" → "ASTM A193 B7"). */
export function gradeStoredName(grade: GradeId): string {
  return `ASTM ${grade.replace(/-/g, ' ')}`;
}

/**
 * E of alloy steel studs, 205 GPa (common practice, from memory: a typical handbook value for
 * Cr-Mo steel at room temperature), used to turn microstrain into load.
 */
export const STUD_YOUNGS_MODULUS_PA = 205e9;

/** Margin over the minimum tensile load for a believable gauge reading: our own choice, not a standard. */
const ABSURD_LOAD_MARGIN = 1.2;

/**
 * The largest believable stud load of a joint: 1.2 × the stud grade's minimum tensile strength ×
 * the thread's tensile stress area (lib/calc); 3 × the target load when the grade is not in our
 * table or the thread is not valid.
 */
export function maxBelievableStudLoad(joint: StoredJointStrength): { maxStudLoadN: number; source: string } {
  const grade = gradeIdOf(joint.studGrade);
  try {
    if (!grade) throw new Error('unknown grade');
    const geometry = threadGeometry(threadSpecOf(joint));
    const props = gradeProperties(grade, geometry.diameterMm);
    const minTensileN = props.tensileMpa * geometry.tensileStressAreaMm2;
    return {
      maxStudLoadN: ABSURD_LOAD_MARGIN * minTensileN,
      source: `${ABSURD_LOAD_MARGIN} × the stud's minimum tensile load of ${formatDecimals(minTensileN / 1000, 1, 0)} kN (${props.label})`,
    };
  } catch {
    return { maxStudLoadN: 3 * joint.targetLoadN, source: `3 × the joint's target load (the stud grade "${joint.studGrade}" is not in our table)` };
  }
}

/**
 * The stud's minimum yield load, N: the grade's minimum yield strength (ASTM A193 / A193M, Table 2,
 * via lib/calc/grades) × the thread's tensile stress area (ASME B1.1 / ISO 898-1, lib/calc/thread).
 * `source` names the table for the screen. Null when the grade is not in our table, the diameter is
 * outside it, or the thread is not valid (the run check then skips the yield rule).
 */
export function studYieldLoad(row: StoredJointStrength): { yieldLoadN: number; source: string } | null {
  const grade = gradeIdOf(row.studGrade);
  if (!grade) return null;
  try {
    const geometry = threadGeometry(threadSpecOf(row));
    const props = gradeProperties(grade, geometry.diameterMm);
    return { yieldLoadN: props.yieldMpa * geometry.tensileStressAreaMm2, source: props.source };
  } catch {
    return null;
  }
}
