'use server';

import { revalidatePath } from 'next/cache';
import { okState } from '@/lib/http/form-state';
import { withActionRole } from '@/lib/http/server-action';
import { changeRole, endSessionsOf, setActive } from '@/lib/data/people';

const ADMIN = ['admin'] as const;

export const changeRoleAction = withActionRole(ADMIN, async (user, form, userId: number) => {
  await changeRole(user, userId, form.get('role'));
  revalidatePath('/people');
  return okState('Role changed. They are signed out and sign in again with the new role.');
});

export const setActiveAction = withActionRole(ADMIN, async (user, _form, userId: number, active: boolean) => {
  await setActive(user, userId, active);
  revalidatePath('/people');
  return okState(active ? 'Account reactivated.' : 'Account deactivated: it is signed out and can no longer sign in.');
});

export const endSessionsAction = withActionRole(ADMIN, async (user, _form, userId: number) => {
  await endSessionsOf(user, userId);
  return okState('Signed out everywhere: every open session of this account has ended.');
});
