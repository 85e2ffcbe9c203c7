/**
 * The one error type of the app. Every layer throws `AppError` with a code; route handlers and
 * server actions map the code to an HTTP status (see `httpStatusOf`) and show `message` to the
 * user. Unknown errors become a generic 500 and their details go to the server log only.
 */
export type AppErrorCode =
  | 'invalid_input' // 422: the request or file is malformed; message says what and where
  | 'unauthenticated' // 401: not signed in
  | 'forbidden' // 403: signed in, wrong role
  | 'not_found' // 404: missing, or not yours (we do not reveal which)
  | 'conflict' // 409: e.g. the same file uploaded twice
  | 'too_large' // 413: a body or file over the limit
  | 'rate_limited' // 429: too many attempts
  | 'unavailable' // 503: the database is down
  | 'internal'; // 500

export interface AppErrorDetails {
  /** Field or column the problem is about, when there is one. */
  field?: string;
  /** 1-based row in an uploaded file, when there is one. */
  row?: number;
  /** Column header or index in an uploaded file, when there is one. */
  column?: string;
  /** Per-field messages, e.g. from zod's flatten().fieldErrors. */
  fieldErrors?: Record<string, string[] | undefined>;
  /** Anything else a client may act on (e.g. the id of an existing run for a duplicate file). */
  [key: string]: unknown;
}

export class AppError extends Error {
  readonly code: AppErrorCode;
  readonly details: AppErrorDetails;

  constructor(code: AppErrorCode, message: string, details: AppErrorDetails = {}) {
    super(message);
    this.name = 'AppError';
    this.code = code;
    this.details = details;
  }
}

const STATUS: Record<AppErrorCode, number> = {
  invalid_input: 422,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
};

export function httpStatusOf(code: AppErrorCode): number {
  return STATUS[code];
}

export function isAppError(value: unknown): value is AppError {
  return value instanceof AppError;
}
