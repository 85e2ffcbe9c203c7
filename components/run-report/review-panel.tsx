'use client';

import { useActionState } from 'react';
import { IDLE_FORM_STATE, type FormState } from '@/lib/http/form-state';
import type { RunReviewDto } from '@/lib/data/run-report';
import { isOverYield } from '@/lib/run-check/check-run';
import { formatDateTime } from '@/lib/format/format-date';
import { SetAsideForm } from './set-aside-form';

type ReviewAction = (state: FormState, formData: FormData) => Promise<FormState>;

/**
 * The run check's findings on the report: the reasons a run was held, the decision taken on them
 * (who, when, note), the form to confirm it and the one set-aside form while it awaits review, and a
 * caution when loads went above the stud's yield load.
 */
export function ReviewPanel({ review, status, action, setAsideAction }: { review: RunReviewDto; status: string; action: ReviewAction | null; setAsideAction: ReviewAction | null }) {
  const waiting = status === 'needs_review';
  return (
    <section aria-labelledby="review-heading" className="rounded-card border border-caution/60 bg-panel p-4 text-sm">
      <h2 id="review-heading" className="text-lg font-semibold">{waiting ? 'Needs review' : 'Checked before it counted'}</h2>
      {waiting ? (
        <p className="mt-1">
          This run is left out of comparisons, assessments and exports of complete runs until an instructor or researcher confirms it or sets it aside.
          Its figures below are computed as for any run.
        </p>
      ) : null}
      <ul className="mt-2 list-disc space-y-1 pl-5" aria-label="Reasons">
        {review.reasons.map((reason) => <li key={reason.rule}>{reason.message}</li>)}
      </ul>
      {isOverYield(review.reasons) ? (
        <p role="note" className="mt-3 rounded-md border border-caution bg-paper p-3">
          <strong>Caution: loads above the stud&rsquo;s yield load.</strong> Check the studs before reuse; follow the owner&rsquo;s procedures for
          studs that may have been over-loaded, local codes and qualified engineering judgement.
        </p>
      ) : null}
      {review.decision ? (
        <p className="mt-3 text-muted">
          {status === 'set_aside' ? 'Set aside' : 'Confirmed'} by {review.decision.by} on {formatDateTime(review.decision.at)}
          {review.decision.note ? <>: &ldquo;{review.decision.note}&rdquo;</> : '.'}
        </p>
      ) : null}
      {waiting && action ? <ReviewForm action={action} /> : null}
      {waiting && setAsideAction ? <div className="no-print mt-4"><SetAsideForm action={setAsideAction} /></div> : null}
    </section>
  );
}

function ReviewForm({ action }: { action: ReviewAction }) {
  const [state, formAction, pending] = useActionState(action, IDLE_FORM_STATE);
  return (
    <form action={formAction} className="no-print mt-4 space-y-2">
      <label htmlFor="review-note" className="block font-medium">Note (what you checked)</label>
      <textarea id="review-note" name="note" rows={3} maxLength={1000} required aria-describedby="review-feedback" className="w-full rounded-md border border-rule bg-paper p-2" />
      <div id="review-feedback" aria-live="polite">
        {state.fieldErrors?.note?.map((e) => <p key={e} className="text-danger">{e}</p>)}
        {state.message ? <p className={state.status === 'ok' ? 'text-good' : 'text-danger'}>{state.message}</p> : null}
      </div>
      <div className="flex flex-wrap gap-2">
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-2 text-accent-ink disabled:opacity-60">
          Confirm: the run counts
        </button>
      </div>
    </form>
  );
}
