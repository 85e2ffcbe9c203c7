'use server';

import { revalidatePath } from 'next/cache';
import { conditionSchema, createHardwareSet, createLubricantLot, hardwareSetSchema, lubricantLotSchema, updateHardwareCondition } from '@/lib/data/hardware';
import { JOINT_LIBRARY_ROLES } from '@/lib/data/joints';
import { okState } from '@/lib/http/form-state';
import { formValues, parseFields, withActionRole } from '@/lib/http/server-action';

/** Hardware sets and lubricant lots (instructor, admin): zod checks, one write, the page revalidated. */
export const createHardwareSetAction = withActionRole(JOINT_LIBRARY_ROLES, async (user, form) => {
  const input = parseFields(hardwareSetSchema, formValues(form), 'The set was not saved: see the marked fields.');
  await createHardwareSet(user, input);
  revalidatePath('/joints/hardware');
  return okState(`Set "${input.name}" saved.`);
});

export const updateConditionAction = withActionRole(JOINT_LIBRARY_ROLES, async (user, form, id: number) => {
  const input = parseFields(conditionSchema, formValues(form), 'The condition was not saved: see the marked field.');
  await updateHardwareCondition(user, id, input.conditionNotes);
  revalidatePath('/joints/hardware');
  return okState('Condition saved.');
});

export const createLubricantLotAction = withActionRole(JOINT_LIBRARY_ROLES, async (user, form) => {
  const input = parseFields(lubricantLotSchema, formValues(form), 'The lot was not saved: see the marked fields.');
  await createLubricantLot(user, input);
  revalidatePath('/joints/hardware');
  return okState(`Lot "${input.lotCode}" saved.`);
});
