import type { AppErrorCode } from '@/lib/http/errors';
import type { FieldErrors } from './joint-input';

/** What a joint-library server action returns to its form (useActionState). */
export interface LibraryFormState {
  /** `error` with a message and per-field messages; `saved` with the id written. */
  status: 'idle' | 'error' | 'saved';
  message: string | null;
  errors: FieldErrors;
  /** The AppError code when the save was refused (e.g. `forbidden`), for the form and tests. */
  code?: AppErrorCode;
  savedId?: number;
}

export const INITIAL_FORM_STATE: LibraryFormState = { status: 'idle', message: null, errors: {} };
