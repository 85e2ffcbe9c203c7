'use server';

import { revalidatePath } from 'next/cache';
import { isAppError } from '@/lib/http/errors';
import { addRunComment, commentSchema } from '@/lib/data/run-comments';
import { getSessionUser } from '@/lib/auth/session';

export interface CommentFormState {
  message: string | null;
  errors: { body?: string[] };
  ok: boolean;
}

/** Adds an instructor's comment to a run (bound to the run id on the page). */
export async function addCommentAction(runId: number, _previous: CommentFormState, formData: FormData): Promise<CommentFormState> {
  const parsed = commentSchema.safeParse({ body: formData.get('body') });
  if (!parsed.success) return { ok: false, message: null, errors: parsed.error.flatten().fieldErrors };
  try {
    await addRunComment(await getSessionUser(), runId, parsed.data.body);
  } catch (error) {
    if (isAppError(error)) return { ok: false, message: error.message, errors: {} };
    console.error('[addCommentAction]', error);
    return { ok: false, message: 'The comment could not be saved. Try again.', errors: {} };
  }
  revalidatePath(`/runs/${runId}`);
  return { ok: true, message: 'Comment saved. The trainee sees it on this report.', errors: {} };
}
