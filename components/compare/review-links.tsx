'use client';

import { useActionState } from 'react';
import { createReviewLinkAction, revokeReviewLinkAction } from '@/app/(lab)/compare/saved/actions';
import { IDLE_FORM_STATE } from '@/lib/http/form-state';
import type { ReviewLinkDto } from '@/lib/data/review-links';
import { formatDateTime } from '@/lib/format/format-date';
import { FieldError } from '../ui/field-error';
import { FormMessage } from '../ui/form-message';

const STATE_WORDS: Record<ReviewLinkDto['state'], string> = { active: 'Open', expired: 'Expired', revoked: 'Withdrawn' };

function RevokeButton({ slug, id }: { slug: string; id: number }) {
  const [state, action, pending] = useActionState(revokeReviewLinkAction.bind(null, slug, id), IDLE_FORM_STATE);
  return (
    <form action={action} className="inline">
      <button type="submit" disabled={pending} className="rounded-md border border-rule px-2 py-0.5 text-xs">{pending ? 'Withdrawing…' : 'Withdraw'}</button>
      {state.status === 'error' ? <FormMessage status={state.status} message={state.message} /> : null}
    </form>
  );
}

/** The author's review links: make one (shown once), see which are open, withdraw one. */
export function ReviewLinks({ slug, links }: { slug: string; links: ReviewLinkDto[] }) {
  const [state, action, pending] = useActionState(createReviewLinkAction.bind(null, slug), IDLE_FORM_STATE);
  return (
    <section aria-labelledby="review-heading" className="space-y-3 rounded-card border border-rule bg-panel p-4 text-sm">
      <h2 id="review-heading" className="text-lg font-semibold">Links for reviewers</h2>
      <p>A review link opens this comparison read-only, with its data package, for someone without an account. Trainees appear under pseudonyms there. The link stops working when it expires or when you withdraw it.</p>
      <form action={action} className="flex flex-wrap items-end gap-2" noValidate>
        <div>
          <label htmlFor="review-days" className="block font-medium">Days open</label>
          <input id="review-days" name="days" type="number" min={1} max={90} defaultValue={30} aria-describedby="review-days-error" className="w-24 max-w-full rounded-md border border-rule bg-paper px-2 py-1" />
        </div>
        <button type="submit" disabled={pending} className="rounded-md bg-accent px-4 py-1.5 font-medium text-accent-ink disabled:opacity-60">{pending ? 'Making…' : 'Make a review link'}</button>
      </form>
      <FieldError id="review-days-error" messages={state.fieldErrors?.days} />
      <FormMessage status={state.status} message={state.message} />
      {state.status === 'ok' && state.data ? (
        <p className="break-all font-mono text-xs" aria-label="New review link">{state.data.link}</p>
      ) : null}
      {links.length ? (
        <ul className="space-y-1">
          {links.map((l) => (
            <li key={l.id} className="flex flex-wrap items-center gap-2">
              <span>Made {formatDateTime(l.createdAt)}, until {formatDateTime(l.expiresAt)}: {STATE_WORDS[l.state]}</span>
              {l.state === 'active' ? <RevokeButton slug={slug} id={l.id} /> : null}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
