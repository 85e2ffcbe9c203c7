import { z, ZodError } from 'zod';
import { isDatabaseDown } from './database-down';
import { isAppError } from './errors';
import type { FieldErrors, FormState } from './form-state';

export const FORM_DATABASE_DOWN_MESSAGE = 'The database is not answering. Nothing was saved; try again in a few seconds.';
export const FORM_INTERNAL_MESSAGE = 'Something went wrong on our side and nothing was saved. Try again.';
export const FORM_INVALID_MESSAGE = 'Nothing was saved: correct the fields marked.';

/**
 * The one mapping from a thrown error to a form's state (every server action, through
 * `withActionRole`):
 * - `AppError`: its message and code; its `fieldErrors`, or else its `field` marked with the message
 *   (not the hidden `version` field of optimistic locking); `row` and `column` as the grid cell;
 * - `ZodError`: `invalid_input` with zod's per-field messages;
 * - the database not answering (Sequelize connection errors, pool timeout): `unavailable`;
 * - anything else: a generic message; the error goes to the server log only.
 */
export function formStateFromError(error: unknown): FormState<never> {
  if (isAppError(error)) {
    const { field, fieldErrors, row, column } = error.details;
    const marked: FieldErrors | undefined = fieldErrors ?? (typeof field === 'string' && field !== 'version' ? { [field]: [error.message] } : undefined);
    return {
      status: 'error',
      code: error.code,
      message: error.message,
      ...(marked ? { fieldErrors: marked } : {}),
      ...(typeof row === 'number' && typeof column === 'string' ? { cell: { row, column } } : {}),
    };
  }
  if (error instanceof ZodError) {
    return { status: 'error', code: 'invalid_input', message: FORM_INVALID_MESSAGE, fieldErrors: z.flattenError(error).fieldErrors as FieldErrors };
  }
  if (isDatabaseDown(error)) return { status: 'error', code: 'unavailable', message: FORM_DATABASE_DOWN_MESSAGE };
  console.error('[action] unexpected error', error);
  return { status: 'error', code: 'internal', message: FORM_INTERNAL_MESSAGE };
}
