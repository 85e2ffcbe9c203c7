import { z } from 'zod';
import { nameSchema } from '@/lib/validation/display-name';
import { isoDateSchema } from '@/lib/validation/iso-date';
import { EQUIPMENT_KINDS } from './equipment-kinds';

const optionalDate = (what: string) => z.union([z.literal(''), isoDateSchema(`Enter ${what} as a real date like 2026-03-31, or leave it empty.`)]).transform((v) => (v === '' ? null : v));

/** The equipment form. */
export const equipmentSchema = z
  .object({
    kind: z.enum(EQUIPMENT_KINDS, { error: 'Choose what kind of equipment this is.' }),
    name: nameSchema({ what: 'a name', max: 160 }),
    serialNumber: nameSchema({ what: 'the serial number', max: 80 }),
    certificate: z.string().trim().max(80, { error: 'Keep the certificate number to 80 characters or fewer.' }).transform((v) => (v === '' ? null : v)),
    calibratedOn: optionalDate('the calibration date'),
    dueOn: optionalDate('the due date'),
    inService: z.preprocess((v) => v === 'on' || v === 'true' || v === true, z.boolean()),
  })
  .refine((v) => v.dueOn === null || v.calibratedOn === null || v.dueOn > v.calibratedOn, { path: ['dueOn'], error: 'The due date must be after the calibration date.' });

export type EquipmentInput = z.infer<typeof equipmentSchema>;
