import { z } from 'zod';
import { parseNumberText } from '@/lib/format/parse-number';

/**
 * A cohort's acceptance criteria for one run. Defaults and limits, with where they come from:
 * - band ±10 % of target: common practice (the demo joints and the runs table use ±10 % too);
 * - CV of the final loads at most 5 %: our classroom default, from memory, unverified — a value a
 *   careful multi-pass torque sequence on a training joint can reach; set it for your course;
 * - no stud above 70 % of the grade's minimum yield load: the upper end of the commonly quoted
 *   40–70 % range, docs/REFERENCE.md §4 (from memory, unverified);
 * - the prescribed pattern followed: on by default (common practice: the procedure's order is the
 *   point of the exercise).
 */
export interface AssessmentCriteria {
  bandPercent: number;
  maxCvPercent: number;
  requirePattern: boolean;
  maxYieldPercent: number;
}

export const DEFAULT_CRITERIA: AssessmentCriteria = { bandPercent: 10, maxCvPercent: 5, requirePattern: true, maxYieldPercent: 70 };

/**
 * Sensible limits for an instructor's setting (ours). The band and CV limits keep a criterion that
 * means something (a ±50 % band passes nearly anything; a CV of 0.1 % is below gauge accuracy);
 * the yield ceiling stays below 95 %, the "never exceed" figure of one tool maker's note for
 * tensioning (docs/REFERENCE.md §4 ✓ [TENS1]).
 */
export const CRITERIA_LIMITS = {
  bandPercent: { min: 1, max: 30 },
  maxCvPercent: { min: 0.5, max: 20 },
  maxYieldPercent: { min: 20, max: 95 },
} as const;

const bounded = (label: string, unit: string, { min, max }: { min: number; max: number }) =>
  z
    .preprocess(
      (v) => (typeof v === 'string' ? parseNumberText(v) : v),
      z.number({ error: `Enter the ${label} as a number in ${unit}.` }).refine(Number.isFinite, { error: `Enter the ${label} as a number in ${unit}.` }),
    )
    .refine((v) => v >= min && v <= max, { error: `The ${label} must be between ${min} and ${max} ${unit}.` });

export const criteriaSchema = z.object({
  bandPercent: bounded('band (± % of target)', '%', CRITERIA_LIMITS.bandPercent),
  maxCvPercent: bounded('largest CV', '%', CRITERIA_LIMITS.maxCvPercent),
  requirePattern: z.boolean(),
  maxYieldPercent: bounded('largest load as % of yield', '%', CRITERIA_LIMITS.maxYieldPercent),
});
