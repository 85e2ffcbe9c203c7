'use server';

import { revalidatePath } from 'next/cache';
import { failureState, type ActionState } from '@/lib/action-state';
import { changeRole, setActive } from '@/lib/data/people';
import { getSessionUser } from '@/lib/session';

export async function changeRoleAction(userId: number, _previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    await changeRole(await getSessionUser(), userId, form.get('role'));
    revalidatePath('/people');
    return { ok: true, message: 'Role changed. It takes effect when they next sign in.' };
  } catch (error) {
    return failureState(error);
  }
}

export async function setActiveAction(userId: number, active: boolean, _previous: ActionState, _form: FormData): Promise<ActionState> {
  try {
    await setActive(await getSessionUser(), userId, active);
    revalidatePath('/people');
    return { ok: true, message: active ? 'Account reactivated.' : 'Account deactivated: it can no longer sign in.' };
  } catch (error) {
    return failureState(error);
  }
}
