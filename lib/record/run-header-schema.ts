/**
 * The run header every way in (upload, grid, stream) asks for, validated with zod on the server.
 * Browser-safe: the record page uses the same field names.
 */
import { z } from 'zod';

const id = z.coerce.number({ error: 'Choose one.' }).int('Choose one.').positive('Choose one.');

export const runHeaderSchema = z.object({
  jointId: id,
  methodId: id,
  lubricantId: id,
  operatorId: id,
  /** Empty string or null means "no cohort". */
  cohortId: z.preprocess((v) => (v === '' || v === undefined ? null : v), id.nullable()),
  /** `YYYY-MM-DDTHH:MM` (a datetime-local value, taken as UTC) or a full ISO time stamp. */
  recordedAt: z
    .string({ error: 'Give the date and time the run was recorded.' })
    .trim()
    .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})?$/, 'Give the date and time the run was recorded, like 2026-03-31T09:30.')
    .refine((v) => !Number.isNaN(Date.parse(/[Z+-]\d{2}:?\d{2}$|Z$/.test(v) ? v : `${v}Z`)), 'That date does not exist.'),
  /** Optional: the hardware set, lubricant lot and gasket condition of the run (empty = not recorded). */
  hardwareSetId: z.preprocess((v) => (v === '' || v === undefined ? null : v), id.nullable()),
  lubricantLotId: z.preprocess((v) => (v === '' || v === undefined ? null : v), id.nullable()),
  gasketCondition: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.enum(['new', 'reused'], { error: 'Choose new or reused.' }).nullable()),
  notes: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.string().trim().max(2000, 'Keep notes under 2,000 characters.').nullable()),
});

export type RunHeaderInput = z.input<typeof runHeaderSchema>;
export type RunHeaderFields = z.output<typeof runHeaderSchema>;

/** The recorded-at value as a Date (a value without a zone is taken as UTC, like the rest of the app). */
export function recordedAtDate(value: string): Date {
  return new Date(/[Z]$|[+-]\d{2}:\d{2}$/.test(value) ? value : `${value}Z`);
}
