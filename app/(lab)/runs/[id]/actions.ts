'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { okState, type FieldErrors } from '@/lib/http/form-state';
import { withActionRole } from '@/lib/http/server-action';
import { addRunComment, commentSchema } from '@/lib/data/run-comments';
import { HOLD_ROLES, saveRunHolds } from '@/lib/data/run-holds';
import { AppError } from '@/lib/http/errors';

/** Adds an instructor's comment to a run (bound to the run id on the page). */
export const addCommentAction = withActionRole(['instructor', 'admin'], async (user, form, runId: number) => {
  const parsed = commentSchema.safeParse({ body: form.get('body') });
  // The field's own message says what is wrong; the form adds none of its own.
  if (!parsed.success) return { status: 'error', code: 'invalid_input', message: null, fieldErrors: z.flattenError(parsed.error).fieldErrors as FieldErrors };
  await addRunComment(user, runId, parsed.data.body);
  revalidatePath(`/runs/${runId}`);
  return okState('Comment saved. The trainee sees it on this report.');
});

const MAX_HOLD_FILE_BYTES = 256 * 1024;

/** Adds hold readings to a run: an uploaded CSV, or the same text typed in (bound to the run id on the page). */
export const addHoldsAction = withActionRole(HOLD_ROLES, async (user, form, runId: number) => {
  const file = form.get('holdFile');
  const typed = String(form.get('holdText') ?? '');
  const units = z.enum(['si', 'us']).catch('si').parse(form.get('units'));
  if (file instanceof File && file.size > MAX_HOLD_FILE_BYTES) throw new AppError('too_large', 'A hold readings file is at most 256 KB.', { field: 'holds' });
  const text = file instanceof File && file.size > 0 ? await file.text() : typed;
  if (text.trim() === '') throw new AppError('invalid_input', 'Choose a hold readings file or type the readings.', { field: 'holds' });
  const { points } = await saveRunHolds(user, runId, text, units);
  revalidatePath(`/runs/${runId}`);
  return okState(`${points} hold time${points === 1 ? '' : 's'} saved.`);
});
