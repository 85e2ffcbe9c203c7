'use server';

import { okState } from '@/lib/http/form-state';
import { ANY_SIGNED_IN, withActionRole } from '@/lib/http/server-action';
import { endOwnSessions } from '@/lib/data/people';

/** "Sign out everywhere" from the user menu: every session of the signed-in person ends (the browser then signs out). */
export const signOutEverywhereAction = withActionRole(ANY_SIGNED_IN, async (user) => {
  await endOwnSessions(user);
  return okState('Signed out everywhere.');
});
