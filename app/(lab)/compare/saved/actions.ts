'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { formValues, parseFields, withActionRole } from '@/lib/http/server-action';
import { okState } from '@/lib/http/form-state';
import { freezeComparison, freezeInputSchema } from '@/lib/data/saved-comparisons';
import { createReviewLink, reviewLinkInputSchema, revokeReviewLink } from '@/lib/data/review-links';

/** "Freeze this comparison" on Compare: stores the results as shown and opens the saved comparison. */
export const freezeComparisonAction = withActionRole(['instructor', 'researcher'], async (user, form) => {
  const input = parseFields(freezeInputSchema, formValues(form), 'Nothing was saved: correct the fields marked.');
  const { slug } = await freezeComparison(user, input);
  redirect(`/compare/saved/${slug}`);
});

/** The author makes a review link for a reviewer without an account; the link is shown once. */
export const createReviewLinkAction = withActionRole(['instructor', 'researcher'], async (user, form, slug: string) => {
  const input = parseFields(reviewLinkInputSchema, formValues(form), 'No link was made: correct the fields marked.');
  const created = await createReviewLink(user, String(slug), input);
  revalidatePath(`/compare/saved/${slug}`);
  return okState('Review link made. Copy it now: it is shown only this once.', created);
});

/** The author withdraws a review link; it stops working at once. */
export const revokeReviewLinkAction = withActionRole(['instructor', 'researcher'], async (user, _form, slug: string, linkId: number) => {
  await revokeReviewLink(user, String(slug), Number(linkId));
  revalidatePath(`/compare/saved/${slug}`);
  return okState('Review link withdrawn.');
});
