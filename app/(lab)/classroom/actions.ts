'use server';

import { revalidatePath } from 'next/cache';
import { saveSceneSchema } from '@/lib/classroom/save-scene-input';
import { CLASSROOM_ROLES, saveSceneRuns } from '@/lib/data/classroom';
import { okState } from '@/lib/http/form-state';
import { formValues, parseFields, withActionRole } from '@/lib/http/server-action';

/** Saves a classroom scene's simulated runs to one of the instructor's cohorts (one transaction). */
export const saveSceneAction = withActionRole(CLASSROOM_ROLES, async (user, form) => {
  const fields = parseFields(saveSceneSchema, formValues(form), 'The runs were not saved: check the fields marked.');
  const { runIds, compareHref } = await saveSceneRuns(user, fields);
  revalidatePath('/runs');
  revalidatePath('/compare');
  return okState(`Saved ${runIds.length} simulated runs to the cohort.`, { compareHref, savedCount: runIds.length });
});
