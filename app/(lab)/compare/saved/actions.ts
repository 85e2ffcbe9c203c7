'use server';

import { redirect } from 'next/navigation';
import { formValues, parseFields, withActionRole } from '@/lib/http/server-action';
import { freezeComparison, freezeInputSchema } from '@/lib/data/saved-comparisons';

/** "Freeze this comparison" on Compare: stores the results as shown and opens the saved comparison. */
export const freezeComparisonAction = withActionRole(['instructor', 'researcher'], async (user, form) => {
  const input = parseFields(freezeInputSchema, formValues(form), 'Nothing was saved: correct the fields marked.');
  const { slug } = await freezeComparison(user, input);
  redirect(`/compare/saved/${slug}`);
});
