'use server';

import { failureState, type ActionState } from '@/lib/http/form-state';
import { endOwnSessions } from '@/lib/data/people';
import { getSessionUser } from '@/lib/auth/session';

/** "Sign out everywhere" from the user menu: every session of the signed-in person ends (the browser then signs out). */
export async function signOutEverywhereAction(_previous: ActionState, _form: FormData): Promise<ActionState> {
  try {
    await endOwnSessions(await getSessionUser());
    return { ok: true, message: 'Signed out everywhere.' };
  } catch (error) {
    return failureState(error);
  }
}
