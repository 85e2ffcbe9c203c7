import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import { z } from 'zod';
import { AppError } from '@/lib/http/errors';
import { nameSchema } from '@/lib/validation/display-name';
import { HardwareSet, Lubricant, LubricantLot } from '@/models';
import { assertRole, type SessionUser } from '../auth/session';
import { JOINT_LIBRARY_ROLES } from './joints';

/**
 * Hardware that wears: sets of studs, nuts and washers (use count raised by each run stored on them,
 * lib/data/runs/hardware-use.ts) with condition notes, and lubricant lots. Instructors and admins
 * keep them, beside the joint library.
 */

export interface HardwareSetSummary {
  id: number;
  name: string;
  description: string | null;
  useCount: number;
  conditionNotes: string | null;
}

export interface LubricantLotSummary {
  id: number;
  lubricantName: string;
  lotCode: string;
}

const optionalText = (max: number) => z.string().trim().max(max, { error: `Keep it to ${max} characters or fewer.` }).transform((v) => (v === '' ? null : v));

export const hardwareSetSchema = z.object({
  name: nameSchema({ what: 'the set name', max: 120 }),
  description: optionalText(240),
  conditionNotes: optionalText(2000),
});

export const conditionSchema = z.object({ conditionNotes: optionalText(2000) });

export const lubricantLotSchema = z.object({
  lubricantId: z.coerce.number({ error: 'Choose a lubricant.' }).int({ error: 'Choose a lubricant.' }).positive({ error: 'Choose a lubricant.' }),
  lotCode: z.string().trim().min(1, { error: 'Enter the lot code.' }).max(60, { error: 'Keep the lot code to 60 characters or fewer.' }),
});

export async function listHardware(user: SessionUser): Promise<{ sets: HardwareSetSummary[]; lots: LubricantLotSummary[] }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const [sets, lots] = await Promise.all([
    HardwareSet.findAll({ order: [['name', 'ASC']] }),
    LubricantLot.findAll({ include: [{ model: Lubricant, as: 'lubricant', attributes: ['name'] }], order: [['lotCode', 'ASC']] }),
  ]);
  return {
    sets: sets.map((s) => ({ id: s.id, name: s.name, description: s.description ?? null, useCount: s.useCount, conditionNotes: s.conditionNotes ?? null })),
    lots: lots.map((l) => ({ id: l.id, lubricantName: (l as LubricantLot & { lubricant: Lubricant }).lubricant.name, lotCode: l.lotCode })),
  };
}

const taken = (error: unknown, message: string, field: string): never => {
  if (error instanceof UniqueConstraintError) throw new AppError('conflict', message, { field });
  throw error;
};

export async function createHardwareSet(user: SessionUser, input: z.output<typeof hardwareSetSchema>): Promise<{ id: number }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  try {
    return { id: (await HardwareSet.create(input)).id };
  } catch (error) {
    return taken(error, `A hardware set called "${input.name}" already exists. Choose another name.`, 'name');
  }
}

/** Records the set's condition (galling, damaged threads, replaced nuts…); the use count is left alone. */
export async function updateHardwareCondition(user: SessionUser, id: number, conditionNotes: string | null): Promise<void> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  const [changed] = await HardwareSet.update({ conditionNotes }, { where: { id } });
  if (changed === 0) throw new AppError('not_found', 'There is no hardware set with this id; it may have been removed.');
}

export async function createLubricantLot(user: SessionUser, input: z.output<typeof lubricantLotSchema>): Promise<{ id: number }> {
  assertRole(user, JOINT_LIBRARY_ROLES);
  if (!(await Lubricant.findByPk(input.lubricantId))) throw new AppError('invalid_input', 'That lubricant does not exist. Choose one from the list.', { field: 'lubricantId' });
  try {
    return { id: (await LubricantLot.create(input)).id };
  } catch (error) {
    return taken(error, `Lot "${input.lotCode}" of this lubricant is already recorded.`, 'lotCode');
  }
}
