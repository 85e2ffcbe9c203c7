/** The hand-entry grid's payload, validated with zod on the server. Browser-safe. */
import { z } from 'zod';

export const MANUAL_UNITS = ['kN', 'N', 'lbf'] as const;
export type ManualUnit = (typeof MANUAL_UNITS)[number];

export const manualEntrySchema = z.object({
  header: z.record(z.string(), z.unknown()),
  unit: z.enum(MANUAL_UNITS, { error: 'Choose the unit the display shows: kN, N or lbf.' }),
  /**
   * One row per step, in order: the loads of every stud (index 0 = position 1) read after that
   * step. Blank cells are null; a row may be left wholly blank only at the end (run stopped early).
   */
  rows: z.array(z.array(z.number().finite().nullable())).min(1, 'Enter the loads of at least one step.').max(2000, 'At most 2,000 steps.'),
});

export type ManualEntry = z.infer<typeof manualEntrySchema>;
