import { z } from 'zod';
import { nameSchema } from '@/lib/validation/display-name';
import { isAppError } from '@/lib/http/errors';
import { GRADES, gradeProperties, type GradeId, type GradeProperties } from '@/lib/calc/grades';
import { percentOfYield, preloadFromPercentOfYield, preloadFromStress, preloadWarnings } from '@/lib/calc/preload';
import { STANDARD_THREADS, threadGeometry, threadSpecSchema, type ThreadGeometry, type ThreadSpec } from '@/lib/calc/thread';
import { fromInputUnit, type UnitSystem } from '@/lib/calc/units';
import type { CalcWarning } from '@/lib/calc/warnings';
import { gradeIdOf } from './joint-properties';
import { parseGasketFields, type JointGasket } from './gasket-input';
import { LOGGER_LINE_FIELDS, parseLoggerLineFields } from './logger-line-input';
import type { LoggerLineFormat } from '@/lib/ingest/logger-line';
import { parseNumberText } from '@/lib/format/parse-number';
import { channelKey } from '@/lib/ingest/channel-map';

/**
 * The joint form as pure functions, shared by the form (live target and messages) and the server
 * action (which recomputes everything and never trusts the browser's target).
 *
 * Form values arrive as text keyed by field name (FormData). Positions are `position-<n>-factor`
 * and `position-<n>-note`, n = 1..studCount, numbered clockwise from 1 (docs/REFERENCE.md §6 ✓ [KNM]).
 */

export const CUSTOM_THREAD = 'custom';
export const TARGET_MODES = ['load', 'percentOfYield', 'stress'] as const;
export type TargetMode = (typeof TARGET_MODES)[number];

/** Per-field messages, as zod's flatten().fieldErrors gives them. */
export type FieldErrors = Record<string, string[] | undefined>;

/** Stud counts the form accepts (a training flange; ours, not a standard's limit). */
export const STUD_COUNT_RANGE = { min: 3, max: 96 } as const;
/** Strain-gauge calibration factors the form accepts (ours: a gauge further off than ±50 % is faulty). */
export const CALIBRATION_RANGE = { min: 0.5, max: 1.5 } as const;

/** The picker value for a thread: a STANDARD_THREADS id, or `custom`. */
export function threadChoiceOf(spec: ThreadSpec): string {
  const std = STANDARD_THREADS.find((t) =>
    t.spec.system === 'inch' && spec.system === 'inch'
      ? t.spec.diameterIn === spec.diameterIn && t.spec.threadsPerInch === spec.threadsPerInch
      : t.spec.system === 'metric' && spec.system === 'metric' && t.spec.diameterMm === spec.diameterMm && t.spec.pitchMm === spec.pitchMm,
  );
  return std ? std.id : CUSTOM_THREAD;
}

/** Typed text read by the one number parser (lib/format/parse-number.ts); empty or unreadable text gives NaN. */
export const numberFromText = parseNumberText;

/** What the target section shows and the server stores. */
export interface JointTargetInput {
  thread: ThreadSpec;
  grade: GradeId;
  mode: TargetMode;
  /** mode `load`: N. */
  loadN: number;
  /** mode `percentOfYield`: %. */
  percent: number;
  /** mode `stress`: MPa. */
  stressMpa: number;
}

export interface JointTargetResult {
  errors: FieldErrors;
  thread?: ThreadGeometry;
  grade?: GradeProperties;
  /** The target stud load, N, with the stress and % of yield it reaches. */
  target?: { loadN: number; stressMpa: number; percentOfYield: number };
  warnings: CalcWarning[];
}

const TARGET_LIMITS = {
  percent: z
    .number({ error: 'Enter the target as a % of yield.' })
    .min(1, { error: 'The % of yield must be between 1 % and 120 %.' })
    .max(120, { error: 'The % of yield must be between 1 % and 120 %.' }),
  stress: z.number({ error: 'Enter the target stress as a number.' }).positive({ error: 'The target stress must be more than zero.' }),
  load: z.number({ error: 'Enter the target stud load as a number.' }).positive({ error: 'The target stud load must be more than zero.' }),
};

const firstMessage = (r: { success: false; error: z.ZodError }) => r.error.issues[0]?.message ?? 'This value is not valid.';

/**
 * The joint's target stud load from a direct load, a % of yield, or a target stress, with the
 * stress area, yield and % of yield reached, and the lib/calc warnings (40–70 % usual range, past
 * yield). Never throws for bad input: problems come back in `errors` keyed by form field.
 */
export function jointTarget(input: JointTargetInput): JointTargetResult {
  const errors: FieldErrors = {};
  const result: JointTargetResult = { errors, warnings: [] };
  const t = threadSpecSchema.safeParse(input.thread);
  if (!t.success) {
    for (const issue of t.error.issues) {
      const key = issue.path[0] === 'threadsPerInch' || issue.path[0] === 'pitchMm' ? 'threadPitch' : 'threadDiameter';
      errors[key] ??= [issue.message];
    }
  } else {
    result.thread = threadGeometry(t.data);
    try {
      result.grade = gradeProperties(input.grade, result.thread.diameterMm);
    } catch (e) {
      if (!isAppError(e)) throw e;
      errors.studGrade = [e.message];
    }
  }
  const area = result.thread?.tensileStressAreaMm2;
  const yieldMpa = result.grade?.yieldMpa;
  let loadN: number | undefined;
  if (input.mode === 'load') {
    const r = TARGET_LIMITS.load.safeParse(input.loadN);
    if (!r.success) errors.targetLoad = [firstMessage(r)];
    else loadN = r.data;
  } else if (input.mode === 'percentOfYield') {
    const r = TARGET_LIMITS.percent.safeParse(input.percent);
    if (!r.success) errors.targetPercent = [firstMessage(r)];
    else if (area !== undefined && yieldMpa !== undefined) loadN = preloadFromPercentOfYield(r.data, yieldMpa, area);
  } else {
    const r = TARGET_LIMITS.stress.safeParse(input.stressMpa);
    if (!r.success) errors.targetStress = [firstMessage(r)];
    else if (area !== undefined) loadN = preloadFromStress(r.data, area);
  }
  if (loadN !== undefined && area !== undefined && yieldMpa !== undefined) {
    const pct = percentOfYield(loadN, area, yieldMpa);
    result.target = { loadN, stressMpa: loadN / area, percentOfYield: pct };
    result.warnings.push(...preloadWarnings({ residualPercentOfYield: pct }));
  }
  const series = threadSeriesNote(input.thread);
  if (series) result.warnings.push(series);
  return result;
}

/**
 * A note when an inch stud of 1 in or more is not 8 threads per inch: flange studs of 1 in and
 * larger use the 8UN series ✓ [CFR46], [TME] (docs/REFERENCE.md §1).
 */
export function threadSeriesNote(thread: ThreadSpec): CalcWarning | null {
  if (thread.system !== 'inch' || !(thread.diameterIn >= 1) || thread.threadsPerInch === 8) return null;
  if (!Number.isFinite(thread.threadsPerInch)) return null;
  return {
    code: 'not-8un',
    severity: 'caution',
    message: `Flange studs of 1 in and larger use the 8-thread series (8UN); this stud has ${thread.threadsPerInch} threads per inch.`,
    // ✓ [CFR46], [TME] (docs/REFERENCE.md §1)
    source: 'ASME B1.1, 8-thread series (8UN)',
  };
}

/** A joint ready to store: SI units, target already computed. */
export interface JointInput {
  name: string;
  nominalSize: string;
  pressureClass: string;
  studCount: number;
  thread: ThreadSpec;
  studGrade: GradeId;
  nutGrade: string | null;
  washer: string | null;
  gasketType: string;
  bandPercent: number;
  targetLoadN: number;
  notes: string | null;
  positions: { position: number; calibrationFactor: number; note: string | null; channel?: string | null }[];
  gasket: JointGasket;
  /** How the logger's live lines look (live capture in the browser); absent = left as stored (training default for a new joint). */
  loggerLine?: LoggerLineFormat;
}

export type ParseResult<T> = { ok: true; value: T } | { ok: false; errors: FieldErrors; message: string };

const text = (what: string, max: number) =>
  z
    .string()
    .trim()
    .min(1, { error: `Enter the ${what}.` })
    .max(max, { error: `Keep the ${what} to ${max} characters or fewer.` });
const optionalText = (what: string, max: number) =>
  z
    .string()
    .trim()
    .max(max, { error: `Keep the ${what} to ${max} characters or fewer.` })
    .transform((v) => (v === '' ? null : v));

const jointScalars = z.object({
  name: nameSchema({ what: 'the joint name' }),
  nominalSize: text('nominal pipe size', 40),
  pressureClass: text('pressure class', 40),
  studCount: z
    .number({ error: 'Enter the number of studs as a whole number.' })
    .int({ error: 'Enter the number of studs as a whole number.' })
    .min(STUD_COUNT_RANGE.min, { error: `A joint has between ${STUD_COUNT_RANGE.min} and ${STUD_COUNT_RANGE.max} studs.` })
    .max(STUD_COUNT_RANGE.max, { error: `A joint has between ${STUD_COUNT_RANGE.min} and ${STUD_COUNT_RANGE.max} studs.` }),
  studGrade: z.enum(GRADES.map((g) => g.id) as [GradeId, ...GradeId[]], { error: 'Choose a stud grade from the list.' }),
  nutGrade: optionalText('nut grade', 80),
  washer: optionalText('washer', 120),
  gasketType: text('gasket type', 160),
  bandPercent: z
    .number({ error: 'Enter the band as a % of target.' })
    .min(0.5, { error: 'The band must be between 0.5 % and 50 % of target.' })
    .max(50, { error: 'The band must be between 0.5 % and 50 % of target.' }),
  notes: optionalText('notes', 2000),
  targetMode: z.enum(TARGET_MODES, { error: 'Choose how the target is set.' }),
  units: z.enum(['si', 'us']).default('si'),
});

const calibration = z
  .number({ error: 'Enter the calibration factor as a number (1 = as calibrated).' })
  .min(CALIBRATION_RANGE.min, { error: `A calibration factor must be between ${CALIBRATION_RANGE.min} and ${CALIBRATION_RANGE.max}.` })
  .max(CALIBRATION_RANGE.max, { error: `A calibration factor must be between ${CALIBRATION_RANGE.min} and ${CALIBRATION_RANGE.max}.` });
const positionNote = optionalText('position note', 240);

/** The thread a form describes: a standard id, or custom system, diameter and pitch. */
export function threadFromForm(values: Record<string, string | undefined>): ThreadSpec {
  const choice = values.threadChoice ?? '';
  if (choice !== CUSTOM_THREAD) {
    const std = STANDARD_THREADS.find((t) => t.id === choice);
    if (std) return std.spec;
  }
  const diameter = numberFromText(values.threadDiameter);
  const pitch = numberFromText(values.threadPitch);
  return values.threadSystem === 'metric'
    ? { system: 'metric', diameterMm: diameter, pitchMm: pitch }
    : { system: 'inch', diameterIn: diameter, threadsPerInch: pitch };
}

/** The target section of a form → `jointTarget` input (typed values in the form's units → SI). */
export function targetInputFromForm(values: Record<string, string | undefined>, units: UnitSystem): JointTargetInput {
  const mode = (TARGET_MODES as readonly string[]).includes(values.targetMode ?? '') ? (values.targetMode as TargetMode) : 'load';
  return {
    thread: threadFromForm(values),
    grade: (gradeIdOf(values.studGrade ?? '') ?? values.studGrade ?? '') as GradeId,
    mode,
    loadN: fromInputUnit('force', numberFromText(values.targetLoad), units),
    percent: numberFromText(values.targetPercent),
    stressMpa: fromInputUnit('stress', numberFromText(values.targetStress), units),
  };
}

/**
 * Checks a submitted joint form and turns it into a `JointInput` (SI units, target computed with
 * lib/calc from the chosen mode). Every problem is returned against its field.
 */
export function parseJointForm(values: Record<string, string | undefined>): ParseResult<JointInput> {
  const errors: FieldErrors = {};
  const scalars = jointScalars.safeParse({
    name: values.name ?? '',
    nominalSize: values.nominalSize ?? '',
    pressureClass: values.pressureClass ?? '',
    studCount: numberFromText(values.studCount),
    studGrade: values.studGrade ?? '',
    nutGrade: values.nutGrade ?? '',
    washer: values.washer ?? '',
    gasketType: values.gasketType ?? '',
    bandPercent: numberFromText(values.bandPercent),
    notes: values.notes ?? '',
    targetMode: values.targetMode ?? '',
    units: values.units === 'us' ? 'us' : 'si',
  });
  if (!scalars.success) Object.assign(errors, z.flattenError(scalars.error).fieldErrors);

  const units: UnitSystem = values.units === 'us' ? 'us' : 'si';
  const target = jointTarget(targetInputFromForm(values, units));
  for (const [key, messages] of Object.entries(target.errors)) errors[key] ??= messages;
  const gasket = parseGasketFields(values, units);
  Object.assign(errors, gasket.errors);
  // A form without the logger line section (older clients, scripts) leaves the stored format as it is.
  const loggerLine = LOGGER_LINE_FIELDS.some((f) => values[f] !== undefined) ? parseLoggerLineFields(values, scalars.success ? scalars.data.studCount : null) : null;
  Object.assign(errors, loggerLine?.errors ?? {});
  if (!errors.studGrade && !errors.threadDiameter && !errors.threadPitch && !target.target && !Object.keys(target.errors).length) {
    errors.targetLoad = ['The target could not be worked out from these values.'];
  }

  const positions: JointInput['positions'] = [];
  if (scalars.success) {
    for (let p = 1; p <= scalars.data.studCount; p += 1) {
      const factorText = values[`position-${p}-factor`];
      const factor = calibration.safeParse(factorText === undefined || factorText.trim() === '' ? 1 : numberFromText(factorText));
      const note = positionNote.safeParse(values[`position-${p}-note`] ?? '');
      if (!factor.success) errors[`position-${p}-factor`] = [`Position ${p}: ${firstMessage(factor)}`];
      if (!note.success) errors[`position-${p}-note`] = [`Position ${p}: ${firstMessage(note)}`];
      const channelText = (values[`position-${p}-channel`] ?? '').trim();
      const key = channelText === '' ? null : channelKey(channelText);
      const clash = key === null ? undefined : positions.find((q) => q.channel != null && channelKey(q.channel) === key);
      if (channelText.length > 60) errors[`position-${p}-channel`] = [`Position ${p}: a channel name has at most 60 characters.`];
      else if (clash) errors[`position-${p}-channel`] = [`Position ${p}: channel ${channelText} is already wired to position ${clash.position}.`];
      if (factor.success && note.success) positions.push({ position: p, calibrationFactor: factor.data, note: note.data, channel: channelText === '' ? null : channelText });
    }
  }

  if (!scalars.success || Object.keys(errors).length > 0 || !target.target || !target.thread) {
    const count = Object.keys(errors).length;
    return { ok: false, errors, message: `The joint was not saved: ${count} field${count === 1 ? ' needs' : 's need'} attention (see the messages beside them).` };
  }
  const s = scalars.data;
  return {
    ok: true,
    value: {
      name: s.name,
      nominalSize: s.nominalSize,
      pressureClass: s.pressureClass,
      studCount: s.studCount,
      thread: threadFromForm(values),
      studGrade: s.studGrade,
      nutGrade: s.nutGrade,
      washer: s.washer,
      gasketType: s.gasketType,
      bandPercent: s.bandPercent,
      targetLoadN: target.target.loadN,
      notes: s.notes,
      positions,
      gasket: gasket.value,
      ...(loggerLine ? { loggerLine: loggerLine.value } : {}),
    },
  };
}

/**
 * Where position p of n sits on a flange drawing: numbered clockwise from 1 at the top
 * (docs/REFERENCE.md §6 ✓ [KNM]). Screen coordinates (y grows downwards) around (cx, cy).
 */
export function positionPoint(p: number, n: number, radius: number, cx = 0, cy = 0): { x: number; y: number } {
  const angle = (2 * Math.PI * (p - 1)) / n; // clockwise from 12 o'clock
  return { x: cx + radius * Math.sin(angle), y: cy - radius * Math.cos(angle) };
}
