/** The hand-entry grid's payload, validated with zod on the server. Browser-safe. */
import { z } from 'zod';
import { readNumber } from '@/lib/format/parse-number';

export const MANUAL_UNITS = ['kN', 'N', 'lbf'] as const;
export type ManualUnit = (typeof MANUAL_UNITS)[number];

/**
 * One cell of the grid: what the person typed, read by the one number parser
 * (lib/format/parse-number.ts: "1,500" is 1500, "1,5" is 1.5), or a number; blank is null.
 */
export const manualCellSchema = z
  .union([z.number().finite(), z.string().max(40, 'A load has at most 40 characters.'), z.null()])
  .transform((cell, ctx): number | null => {
    if (typeof cell !== 'string') return cell;
    const reading = readNumber(cell);
    if (reading.kind === 'number') return reading.value;
    if (reading.kind === 'empty') return null;
    ctx.addIssue({ code: 'custom', message: `"${cell.trim()}" ${reading.reason}. Type digits, with a point or comma for decimals.` });
    return z.NEVER;
  });

export const manualEntrySchema = z.object({
  header: z.record(z.string(), z.unknown()),
  unit: z.enum(MANUAL_UNITS, { error: 'Choose the unit the display shows: kN, N or lbf.' }),
  /**
   * One row per step, in order: the loads of every stud (index 0 = position 1) read after that
   * step. Blank cells are null; a row may be left wholly blank only at the end (run stopped early).
   */
  rows: z.array(z.array(manualCellSchema)).min(1, 'Enter the loads of at least one step.').max(2000, 'At most 2,000 steps.'),
  /**
   * Tensioner methods only, one per row (index = row): the studs the step pulled ("1 3 5 7") and
   * each one's applied load by position (index 0 = stud 1, blank for a stud not pulled), in the
   * grid's unit; the row's loads are then the residual loads after release (lib/record/manual-pulls.ts).
   */
  pulls: z
    .array(z.object({ studs: z.string().max(200, 'A list of studs has at most 200 characters.'), applied: z.array(manualCellSchema).max(200) }))
    .max(2000, 'At most 2,000 steps.')
    .optional(),
  /** Hold readings after a pass, in the layout of lib/record/hold-readings.ts (kN, or lbf when the grid is in lbf); optional. */
  holds: z.string().max(20_000, 'Hold readings have at most 20,000 characters.').optional(),
});

export type ManualEntry = z.infer<typeof manualEntrySchema>;
