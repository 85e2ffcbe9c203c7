import { z } from 'zod';
import { nameSchema } from '@/lib/validation/display-name';
import { circularOrder, crossPatternOrder, validatePassOrder } from '@/lib/sim/patterns';
import { TENSIONER_COVERAGES, type TensionerCoverage } from '@/lib/calc/tensioner-coverage';
import type { MethodPass, ToolKind } from '@/models/method';
import { numberFromText, STUD_COUNT_RANGE, type FieldErrors, type ParseResult } from './joint-input';

/**
 * The method and lubricant forms as pure functions. A method's passes each carry a % of target
 * and an explicit stud order for every stud count the method is used with; form fields are
 * `pass-<i>-percent` and `pass-<i>-order-<studCount>` (i from 0), with `passCount` and
 * `studCounts` ("8,12") saying which exist.
 */

/**
 * The tool kinds of models/method.ts, repeated here so client forms do not import the model (and
 * Sequelize); `satisfies` keeps the two lists in step at compile time.
 */
export const TOOL_KINDS = ['manual_torque_wrench', 'hydraulic_torque_wrench', 'hydraulic_tensioner', 'other'] as const satisfies readonly ToolKind[];

export const TOOL_LABELS: Record<ToolKind, string> = {
  manual_torque_wrench: 'Manual torque wrench',
  hydraulic_torque_wrench: 'Hydraulic torque wrench',
  hydraulic_tensioner: 'Hydraulic tensioner',
  other: 'Other tool',
};

export const MAX_PASSES = 8;
export const MAX_CHECK_PASSES = 5;
/** Nut factor limits the form accepts (the same as the calculator's, lib/calc/calculate.ts). */
export const NUT_FACTOR_RANGE = { min: 0.05, max: 0.6 } as const;

/**
 * Reads a typed stud order: numbers separated by spaces, commas or hyphens ("1-5-3-7" as the
 * trade writes it). A token that is not a whole number comes back as NaN so the check can name it.
 */
export function parseOrderText(text: string): number[] {
  return text
    .split(/[\s,;\-–]+/)
    .filter((token) => token !== '')
    .map((token) => (/^\d+$/.test(token) ? Number(token) : Number.NaN));
}

/** An order as the form shows it: "1 5 3 7 2 6 4 8". */
export const orderText = (order: readonly number[]): string => order.join(' ');

/**
 * The check shown beside a pass: validatePassOrder's sentence (lib/sim/patterns), with a first
 * capital, or null when every stud appears exactly once.
 */
export function passOrderMessage(order: readonly number[], studCount: number): string | null {
  if (order.length === 0) return `Enter the order of the ${studCount} studs for this pass.`;
  const check = validatePassOrder(
    order.map((p) => (Number.isNaN(p) ? -1 : p)),
    studCount,
  );
  if (check.valid) return null;
  const sentence = check.message ?? 'pass order is not valid';
  return `${sentence.charAt(0).toUpperCase()}${sentence.slice(1)}.`;
}

/** The generated order of a pattern, or null when the pattern cannot be made for that count (cross needs a multiple of 4). */
export function generatedOrder(pattern: 'cross' | 'circular', studCount: number): number[] | null {
  if (pattern === 'circular') return circularOrder(studCount);
  return studCount >= 4 && studCount % 4 === 0 ? crossPatternOrder(studCount) : null;
}

/** The pattern a pass's orders make: cross or circular when every order is that generated order, else custom. */
export function patternOf(orderByStudCount: Record<string, number[]>): MethodPass['pattern'] {
  const entries = Object.entries(orderByStudCount);
  if (entries.length === 0) return 'custom';
  const same = (a: readonly number[], b: readonly number[] | null) => b !== null && a.length === b.length && a.every((v, i) => v === b[i]);
  for (const pattern of ['cross', 'circular'] as const) {
    if (entries.every(([n, order]) => same(order, generatedOrder(pattern, Number(n))))) return pattern;
  }
  return 'custom';
}

export interface MethodInput {
  name: string;
  toolKind: ToolKind;
  passes: MethodPass[];
  checkPasses: number;
  tensionerCoverage: TensionerCoverage;
  notes: string | null;
}

/**
 * The coverage a new tensioner method starts with in the form (a tool on every stud). A training
 * default: the centre sets its own from the tool sets it has.
 */
export const DEFAULT_TENSIONER_COVERAGE: TensionerCoverage = 'every_stud';

const tensionerCoverageSchema = z.enum(TENSIONER_COVERAGES, { error: 'Choose how many studs the tool set pulls at once from the list.' });

/**
 * The coverage field against the tool and the stud counts: only a tensioner pulls several studs at
 * once, and a tool on every second stud needs an even stud count. Null when it fits.
 */
export function tensionerCoverageProblem(coverage: TensionerCoverage, toolKind: string, studCounts: readonly number[]): string | null {
  if (coverage === 'one_stud') return null;
  if (toolKind !== 'hydraulic_tensioner') return 'Only a hydraulic tensioner set pulls several studs at once: choose one tool, stud by stud, for this tool.';
  const odd = studCounts.filter((n) => n % 2 !== 0);
  if (coverage === 'every_second_stud' && odd.length > 0) return `A tensioner on every second stud needs an even number of studs; ${odd.join(', ')} ${odd.length === 1 ? 'is' : 'are'} odd.`;
  return null;
}

const methodScalars = z.object({
  name: nameSchema({ what: 'the method name' }),
  toolKind: z.enum(TOOL_KINDS, { error: 'Choose the tool kind from the list.' }),
  checkPasses: z
    .number({ error: 'Enter the number of check passes as a whole number (0 for none).' })
    .int({ error: 'Enter the number of check passes as a whole number (0 for none).' })
    .min(0, { error: `Check passes must be between 0 and ${MAX_CHECK_PASSES}.` })
    .max(MAX_CHECK_PASSES, { error: `Check passes must be between 0 and ${MAX_CHECK_PASSES}.` }),
  notes: z
    .string()
    .trim()
    .max(2000, { error: 'Keep the notes to 2000 characters or fewer.' })
    .transform((v) => (v === '' ? null : v)),
});

const percentOfTarget = z
  .number({ error: 'Enter the % of target for this pass.' })
  .min(1, { error: 'A pass is between 1 % and 120 % of target.' })
  .max(120, { error: 'A pass is between 1 % and 120 % of target.' });

/** The stud counts a form lists ("8,12" → [8, 12]); invalid entries dropped, sorted, unique. */
export function studCountsFromText(text: string | undefined): number[] {
  const counts = (text ?? '')
    .split(/[\s,]+/)
    .map(Number)
    .filter((n) => Number.isInteger(n) && n >= STUD_COUNT_RANGE.min && n <= STUD_COUNT_RANGE.max);
  return [...new Set(counts)].sort((a, b) => a - b);
}

/** Checks a submitted method form; every problem comes back against its field. */
export function parseMethodForm(values: Record<string, string | undefined>): ParseResult<MethodInput> {
  const errors: FieldErrors = {};
  const scalars = methodScalars.safeParse({
    name: values.name ?? '',
    toolKind: values.toolKind ?? '',
    checkPasses: numberFromText(values.checkPasses),
    notes: values.notes ?? '',
  });
  if (!scalars.success) Object.assign(errors, z.flattenError(scalars.error).fieldErrors);

  const studCounts = studCountsFromText(values.studCounts);
  if (studCounts.length === 0) errors.studCounts = ['Give at least one stud count the method is used with.'];
  // A form without the field (a torque tool hides it) is one tool, stud by stud.
  const coverage = tensionerCoverageSchema.safeParse(values.tensionerCoverage || 'one_stud');
  const coverageProblem = coverage.success ? tensionerCoverageProblem(coverage.data, values.toolKind ?? '', studCounts) : coverage.error.issues[0]?.message ?? 'Not valid.';
  if (coverageProblem) errors.tensionerCoverage = [coverageProblem];
  const passCount = numberFromText(values.passCount);
  if (!Number.isInteger(passCount) || passCount < 1 || passCount > MAX_PASSES) {
    errors.passCount = [`A method has between 1 and ${MAX_PASSES} passes.`];
  }
  const passes: MethodPass[] = [];
  if (!errors.passCount) {
    for (let i = 0; i < passCount; i += 1) {
      const pct = percentOfTarget.safeParse(numberFromText(values[`pass-${i}-percent`]));
      if (!pct.success) errors[`pass-${i}-percent`] = [`Pass ${i + 1}: ${pct.error.issues[0]?.message ?? 'not valid.'}`];
      const orderByStudCount: Record<string, number[]> = {};
      for (const n of studCounts) {
        const order = parseOrderText(values[`pass-${i}-order-${n}`] ?? '');
        const message = passOrderMessage(order, n);
        if (message) errors[`pass-${i}-order-${n}`] = [`Pass ${i + 1}, ${n} studs: ${message}`];
        else orderByStudCount[String(n)] = order;
      }
      if (pct.success) passes.push({ percentOfTarget: pct.data, pattern: patternOf(orderByStudCount), orderByStudCount });
    }
  }

  if (!scalars.success || Object.keys(errors).length > 0) {
    const count = Object.keys(errors).length;
    return { ok: false, errors, message: `The method was not saved: ${count} field${count === 1 ? ' needs' : 's need'} attention (see the messages beside them).` };
  }
  return { ok: true, value: { ...scalars.data, passes, tensionerCoverage: coverage.success ? coverage.data : 'one_stud' } };
}

export interface LubricantInput {
  name: string;
  nominalNutFactor: number;
  notes: string | null;
}

const lubricantSchema = z.object({
  name: nameSchema({ what: 'the lubricant name' }),
  nominalNutFactor: z
    .number({ error: 'Enter the nominal nut factor (K) as a number, e.g. 0.16.' })
    .min(NUT_FACTOR_RANGE.min, { error: 'The nut factor (K) must be between 0.05 and 0.60.' })
    .max(NUT_FACTOR_RANGE.max, { error: 'The nut factor (K) must be between 0.05 and 0.60.' }),
  notes: z
    .string()
    .trim()
    .max(2000, { error: 'Keep the notes to 2000 characters or fewer.' })
    .transform((v) => (v === '' ? null : v)),
});

/** Checks a submitted lubricant form. */
export function parseLubricantForm(values: Record<string, string | undefined>): ParseResult<LubricantInput> {
  const parsed = lubricantSchema.safeParse({
    name: values.name ?? '',
    nominalNutFactor: numberFromText(values.nominalNutFactor),
    notes: values.notes ?? '',
  });
  if (parsed.success) return { ok: true, value: parsed.data };
  const errors = z.flattenError(parsed.error).fieldErrors as FieldErrors;
  const count = Object.keys(errors).length;
  return { ok: false, errors, message: `The lubricant was not saved: ${count} field${count === 1 ? ' needs' : 's need'} attention.` };
}
