'use server';

import { revalidatePath } from 'next/cache';
import { failureState, type ActionState } from '@/lib/http/form-state';
import { changeRole, endSessionsOf, setActive } from '@/lib/data/people';
import { getSessionUser } from '@/lib/auth/session';

export async function changeRoleAction(userId: number, _previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    await changeRole(await getSessionUser(), userId, form.get('role'));
    revalidatePath('/people');
    return { ok: true, message: 'Role changed. They are signed out and sign in again with the new role.' };
  } catch (error) {
    return failureState(error);
  }
}

export async function setActiveAction(userId: number, active: boolean, _previous: ActionState, _form: FormData): Promise<ActionState> {
  try {
    await setActive(await getSessionUser(), userId, active);
    revalidatePath('/people');
    return { ok: true, message: active ? 'Account reactivated.' : 'Account deactivated: it is signed out and can no longer sign in.' };
  } catch (error) {
    return failureState(error);
  }
}

export async function endSessionsAction(userId: number, _previous: ActionState, _form: FormData): Promise<ActionState> {
  try {
    await endSessionsOf(await getSessionUser(), userId);
    return { ok: true, message: 'Signed out everywhere: every open session of this account has ended.' };
  } catch (error) {
    return failureState(error);
  }
}
