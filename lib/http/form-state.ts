import { isAppError } from './errors';

/** What every server action returns to its form (useActionState). */
export interface ActionState {
  ok: boolean;
  message: string | null;
  errors?: Record<string, string[] | undefined>;
  /** Values a form may show after success (e.g. the e-mail to sign in with). */
  data?: Record<string, string>;
}

export const IDLE_STATE: ActionState = { ok: false, message: null };

/** Turns a thrown error into the form's state: AppError messages are shown, anything else is logged. */
export function failureState(error: unknown): ActionState {
  if (isAppError(error)) {
    const fieldErrors = error.details.fieldErrors;
    return { ok: false, message: error.message, ...(fieldErrors ? { errors: fieldErrors } : {}) };
  }
  const name = (error as { name?: string } | null)?.name ?? '';
  if (name.startsWith('SequelizeConnection')) return { ok: false, message: 'The database is not answering. Nothing was saved; try again in a few seconds.' };
  console.error('[action] unexpected error', error);
  return { ok: false, message: 'Something went wrong on our side and nothing was saved. Try again.' };
}
