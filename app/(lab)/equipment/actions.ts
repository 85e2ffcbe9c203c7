'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { saveEquipment } from '@/lib/data/equipment';
import { equipmentSchema } from '@/lib/equipment/equipment-input';
import { formValues, parseFields, withActionRole } from '@/lib/http/server-action';

/** Saves an item of the register (admin); bind the id, null for a new item. */
export const saveEquipmentAction = withActionRole(['admin'], async (user, form, id: number | null) => {
  const values = formValues(form);
  await saveEquipment(user, id, parseFields(equipmentSchema, { ...values, inService: values.inService ?? 'off' }, 'Check the marked fields.'), values.version);
  revalidatePath('/equipment');
  redirect('/equipment?saved=1');
});
