'use client';

import { useActionState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import type { RunCommentDto } from '@/lib/data/run-report';
import { formatDateTime } from '@/lib/format/format-date';

type CommentAction = (state: FormState, formData: FormData) => Promise<FormState>;

export function CommentPanel({ comments, action }: { comments: RunCommentDto[]; action: CommentAction | null }) {
  return (
    <section aria-labelledby="comments-heading" className="rounded-card border border-rule bg-panel p-4">
      <h2 id="comments-heading" className="text-lg font-semibold">Comments</h2>
      {comments.length === 0 ? (
        <p className="mt-2 text-sm text-muted">No comments yet.{action ? <span className="no-print"> Add one below; the trainee sees it on this report.</span> : null}</p>
      ) : (
        <ul className="mt-2 space-y-3">
          {comments.map((comment) => (
            <li key={comment.id} className="rounded-md border border-rule bg-paper p-3">
              <div className="text-xs text-muted">{comment.authorName} · {formatDateTime(comment.createdAt)}</div>
              <p className="mt-1 whitespace-pre-wrap">{comment.body}</p>
            </li>
          ))}
        </ul>
      )}
      {action ? <CommentForm action={action} /> : null}
    </section>
  );
}

function CommentForm({ action }: { action: CommentAction }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  return (
    <form action={formAction} className="no-print mt-4 space-y-2">
      <label htmlFor="comment-body" className="block text-sm font-medium">Comment for the trainee</label>
      <textarea id="comment-body" name="body" rows={3} maxLength={4000} aria-describedby="comment-feedback"
        className="w-full rounded-md border border-rule bg-paper p-2" placeholder="What went well, what to change next time" />
      <div id="comment-feedback" aria-live="polite" className="text-sm">
        {state.fieldErrors?.body?.map((e) => <p key={e} className="text-danger">{e}</p>)}
        {state.message ? <p className={state.status === 'ok' ? 'text-good' : 'text-danger'}>{state.message}</p> : null}
      </div>
      <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-accent-ink disabled:opacity-60">
        {pending ? 'Saving…' : 'Add comment'}
      </button>
    </form>
  );
}
