import 'server-only';
import { z } from 'zod';
import { AppError } from '../http/errors';

/** The answer to a save made from a form that was opened before someone else's save. */
export const STALE_EDIT_MESSAGE = 'This was changed by someone else since you opened it; reload the page to see the current values. Nothing was saved.';

/** The version an edit form sends back (hidden field `version`). */
export const versionSchema = z.coerce.number().int().min(0).max(2 ** 31);

/**
 * Optimistic locking for rows edited through forms (joints, methods, lubricants, cohort criteria):
 * the caller holds the row with SELECT … FOR UPDATE, so simultaneous saves queue; the first whose
 * version matches saves and raises it by one, every later one answers `conflict` and changes nothing.
 * @returns the version to store with the edit.
 */
export function nextVersion(current: number, sent: unknown): number {
  const parsed = versionSchema.safeParse(sent);
  if (!parsed.success) throw new AppError('conflict', STALE_EDIT_MESSAGE, { field: 'version' });
  if (parsed.data !== current) throw new AppError('conflict', STALE_EDIT_MESSAGE, { field: 'version' });
  return current + 1;
}
