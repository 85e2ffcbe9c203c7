import { z } from 'zod';
import { isoDateSchema } from '@/lib/validation/iso-date';
import { nameSchema } from '@/lib/validation/display-name';

/** What the calibration form sends: the day, the load cell's certificate, the table (grid or file, one text layout). */
export const calibrationSessionSchema = z
  .object({
    performedOn: isoDateSchema('Enter the day of the calibration as a real date like 2026-03-31.'),
    /** Empty = the centre's interval after the day of the calibration. */
    dueOn: z.union([z.literal(''), isoDateSchema('Enter the next due date as a real date like 2027-03-31.')]).default(''),
    loadCellCertificate: nameSchema({ what: 'the load cell certificate number', max: 80 }),
    loadCellCertifiedOn: isoDateSchema('Enter the certificate date as a real date like 2026-01-15.'),
    loadCellDueOn: isoDateSchema('Enter the certificate due date as a real date like 2027-01-15.'),
    table: z.string().max(20_000, { error: 'The calibration table is too long (at most 20,000 characters).' }),
  })
  .refine((v) => v.loadCellDueOn >= v.loadCellCertifiedOn, { path: ['loadCellDueOn'], error: 'The certificate due date cannot be before its date.' })
  .refine((v) => v.loadCellDueOn >= v.performedOn, { path: ['loadCellDueOn'], error: "The load cell's certificate was past due on the day of the calibration; calibrate against a load cell in date." })
  .refine((v) => v.dueOn === '' || v.dueOn > v.performedOn, { path: ['dueOn'], error: 'The next due date must be after the day of the calibration.' });

export type CalibrationSessionInput = z.infer<typeof calibrationSessionSchema>;

/** The day `months` after an ISO date (clamped to the month's last day), as YYYY-MM-DD. */
export function addMonths(isoDate: string, months: number): string {
  const [y, m, d] = isoDate.split('-').map(Number) as [number, number, number];
  const target = new Date(Date.UTC(y, m - 1 + months, 1));
  const last = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d, last));
  return target.toISOString().slice(0, 10);
}
