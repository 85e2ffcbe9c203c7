import 'server-only';
import { unstable_rethrow } from 'next/navigation';
import { z } from 'zod';
import { assertRole, getSessionUser, type SessionUser } from '../auth/session';
import { AppError } from './errors';
import { formStateFromError } from './form-error';
import type { FieldErrors, FormState } from './form-state';
import type { Role } from '@/models/user';

/** Every role: actions any signed-in person may use (e.g. "Sign out everywhere"). */
export const ANY_SIGNED_IN: readonly Role[] = ['admin', 'instructor', 'researcher', 'trainee'];

type Action<B extends unknown[], T> = (...args: [...B, FormState<T>, FormData]) => Promise<FormState<T>>;

async function settle<T>(work: () => Promise<FormState<T>>): Promise<FormState<T>> {
  try {
    return await work();
  } catch (error) {
    unstable_rethrow(error); // redirect() and notFound() are Next's control flow, not failures
    return formStateFromError(error);
  }
}

function split<B extends unknown[]>(args: readonly unknown[]): { bound: B; form: FormData } {
  return { bound: args.slice(0, -2) as B, form: args[args.length - 1] as FormData };
}

/**
 * The one wrapper for server actions, the counterpart of `withRole` for route handlers: reads the
 * session, checks the role, runs the handler and turns any error into the form's state
 * (`formStateFromError`). Arguments bound on the page come after the form:
 * `export const inviteAction = withActionRole(COHORT_ROLES, async (user, form, cohortId: number) => …)`
 * is used as `useActionState(inviteAction.bind(null, cohortId), IDLE_FORM_STATE)`.
 */
export function withActionRole<B extends unknown[], T = undefined>(
  roles: readonly Role[],
  handler: (user: SessionUser, form: FormData, ...bound: B) => Promise<FormState<T>>,
): Action<B, T> {
  return async (...args) =>
    settle(async () => {
      const { bound, form } = split<B>(args);
      const user = await getSessionUser();
      assertRole(user, roles);
      return handler(user, form, ...bound);
    });
}

/** The same wrapper for the public actions, where a one-time link or an e-mail address is the credential. */
export function withPublicAction<B extends unknown[], T = undefined>(handler: (form: FormData, ...bound: B) => Promise<FormState<T>>): Action<B, T> {
  return async (...args) =>
    settle(async () => {
      const { bound, form } = split<B>(args);
      return handler(form, ...bound);
    });
}

/** Parses form input with zod; refuses it as `invalid_input` with `message` and the per-field messages. */
export function parseFields<S extends z.ZodType>(schema: S, input: unknown, message: string): z.infer<S> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) throw new AppError('invalid_input', message, { fieldErrors: z.flattenError(parsed.error).fieldErrors as FieldErrors });
  return parsed.data;
}

/** FormData → plain text values (files ignored), for zod. */
export function formValues(form: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === 'string') values[key] = value;
  return values;
}
