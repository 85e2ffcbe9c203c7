'use server';

import { failureState, type ActionState } from '@/lib/http/form-state';
import { RESET_REQUESTED_MESSAGE, requestPasswordReset, setPasswordWithToken } from '@/lib/data/invitations';
import type { TokenPurpose } from '@/models/one-time-token';

export async function setPasswordAction(token: string, purpose: TokenPurpose, _previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    const name = form.get('name');
    const { email } = await setPasswordWithToken(token, purpose, {
      ...(typeof name === 'string' ? { name } : {}),
      password: String(form.get('password') ?? ''),
      confirm: String(form.get('confirm') ?? ''),
    });
    return { ok: true, message: 'Password set. Signing you in…', data: { email } };
  } catch (error) {
    return failureState(error);
  }
}

export async function requestResetAction(_previous: ActionState, form: FormData): Promise<ActionState> {
  try {
    await requestPasswordReset(form.get('email'));
    return { ok: true, message: RESET_REQUESTED_MESSAGE };
  } catch (error) {
    return failureState(error);
  }
}
