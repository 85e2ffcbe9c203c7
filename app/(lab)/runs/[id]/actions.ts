'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { okState, type FieldErrors } from '@/lib/http/form-state';
import { parseFields, withActionRole } from '@/lib/http/server-action';
import { REVIEW_ROLES, reviewRun, runReviewSchema } from '@/lib/data/runs/run-review';
import { addRunComment, commentSchema } from '@/lib/data/run-comments';
import { confirmAttempt, restoreRun, setRunAside } from '@/lib/data/qualification/attempts';
import { HOLD_ROLES, saveRunHolds } from '@/lib/data/run-holds';
import { AppError } from '@/lib/http/errors';
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

/** The cohort's instructor confirms they witnessed a trainee-recorded run (it becomes an assessed attempt). */
export const confirmAttemptAction = withActionRole(['instructor'], async (user, _form, runId: number) => {
  await confirmAttempt(user, runId);
  revalidatePath(`/runs/${runId}`);
  return okState('Confirmed: this run now counts as an assessed attempt and can be signed off.');
});

/**
 * Sets a run aside with a reason: the one action behind the attempt panel and the needs-review panel
 * (instructor; researcher for research use; admin; the rule is `setRunAside`'s).
 */
export const setAsideAction = withActionRole(['instructor', 'researcher', 'admin'], async (user, form, runId: number) => {
  await setRunAside(user, runId, form.get('reason'));
  revalidatePath(`/runs/${runId}`);
  revalidatePath('/runs');
  return okState('Set aside. The run is kept on record but left out of comparisons, progress and assessments.');
});

/** Restores a set-aside run with a reason. */
export const restoreRunAction = withActionRole(['instructor', 'researcher', 'admin'], async (user, form, runId: number) => {
  await restoreRun(user, runId, form.get('reason'));
  revalidatePath(`/runs/${runId}`);
  return okState('Restored. The run counts again.');
});

/** Confirms a run held for review, with a note: it counts from now on (bound to the run id on the page; setting it aside is `setAsideAction`). */
export const reviewRunAction = withActionRole(REVIEW_ROLES, async (user, form, runId: number) => {
  const input = parseFields(runReviewSchema, { note: form.get('note') }, 'The confirmation needs a note.');
  await reviewRun(user, runId, input);
  revalidatePath(`/runs/${runId}`);
  revalidatePath('/runs');
  return okState('Run confirmed: it now counts in comparisons, assessments and exports.');
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

/** Records the tools a run was made with (bound to the run id; instructors and admins). */
export const setRunToolsAction = withActionRole(['instructor', 'admin'], async (user, form, runId: number) => {
  const ids = z.array(z.coerce.number().int().positive()).max(50).parse(form.getAll('tool'));
  await setRunTools(user, runId, ids);
  revalidatePath(`/runs/${runId}`);
  return okState('Tools saved.');
});
