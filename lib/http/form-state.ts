import type { AppErrorCode } from './errors';

/** Per-field messages, as zod's `flattenError(...).fieldErrors` gives them. */
export type FieldErrors = Record<string, string[] | undefined>;

/**
 * What every server action returns to its form (useActionState), one shape for all of them:
 * - `idle` before the first submit;
 * - `ok` with a message and, where the form needs one, `data` (the run saved, the token made,
 *   the e-mail to sign in with, the compare link);
 * - `error` with a message, `fieldErrors` only when fields are to be marked, the AppError `code`
 *   (`forbidden`, `conflict`, `unavailable`, …) and `cell` when a grid cell is at fault.
 * Built by `lib/http/form-error.ts` (errors) and `lib/http/server-action.ts` (the wrapper).
 */
export interface FormState<T = undefined> {
  status: 'idle' | 'ok' | 'error';
  message: string | null;
  fieldErrors?: FieldErrors;
  code?: AppErrorCode;
  /** Row (1-based) and column of a grid or file error, to mark the cell. */
  cell?: { row: number; column: string };
  data?: T;
}

/** The state a form starts in. */
export const IDLE_FORM_STATE: FormState<never> = { status: 'idle', message: null };

/** A success with its message and, optionally, what the form shows next. */
export function okState<T = undefined>(message: string, data?: T): FormState<T> {
  return data === undefined ? { status: 'ok', message } : { status: 'ok', message, data };
}

