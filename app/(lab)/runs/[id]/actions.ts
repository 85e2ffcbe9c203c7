'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { okState, type FieldErrors } from '@/lib/http/form-state';
import { withActionRole } from '@/lib/http/server-action';
import { addRunComment, commentSchema } from '@/lib/data/run-comments';
import { setRunTools } from '@/lib/data/equipment';

/** Adds an instructor's comment to a run (bound to the run id on the page). */
export const addCommentAction = withActionRole(['instructor', 'admin'], async (user, form, runId: number) => {
  const parsed = commentSchema.safeParse({ body: form.get('body') });
  // The field's own message says what is wrong; the form adds none of its own.
  if (!parsed.success) return { status: 'error', code: 'invalid_input', message: null, fieldErrors: z.flattenError(parsed.error).fieldErrors as FieldErrors };
  await addRunComment(user, runId, parsed.data.body);
  revalidatePath(`/runs/${runId}`);
  return okState('Comment saved. The trainee sees it on this report.');
});

/** Records the tools a run was made with (bound to the run id; instructors and admins). */
export const setRunToolsAction = withActionRole(['instructor', 'admin'], async (user, form, runId: number) => {
  const ids = z.array(z.coerce.number().int().positive()).max(50).parse(form.getAll('tool'));
  await setRunTools(user, runId, ids);
  revalidatePath(`/runs/${runId}`);
  return okState('Tools saved.');
});
