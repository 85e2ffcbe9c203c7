'use server';

import { okState } from '@/lib/http/form-state';
import { withPublicAction } from '@/lib/http/server-action';
import { RESET_REQUESTED_MESSAGE, requestPasswordReset, setPasswordWithToken } from '@/lib/data/invitations';
import type { TokenPurpose } from '@/models/one-time-token';

export const setPasswordAction = withPublicAction(async (form, token: string, purpose: TokenPurpose) => {
  const name = form.get('name');
  const { email } = await setPasswordWithToken(token, purpose, {
    ...(typeof name === 'string' ? { name } : {}),
    password: String(form.get('password') ?? ''),
    confirm: String(form.get('confirm') ?? ''),
  });
  return okState('Password set. Signing you in…', { email });
});

export const requestResetAction = withPublicAction(async (form) => {
  await requestPasswordReset(form.get('email'));
  return okState(RESET_REQUESTED_MESSAGE);
});
