import { z } from 'zod';

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a calendar date written YYYY-MM-DD that exists (2026-02-28 yes, 2026-02-30 and 9999-99-99 no), years 1900–2999. */
export function isRealIsoDate(text: string): boolean {
  const match = ISO_DATE.exec(text);
  if (!match) return false;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (year < 1900 || year > 2999) return false;
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

/**
 * The one zod rule for a date in a query string or form (`from`, `to`, course days): YYYY-MM-DD
 * and a day that exists, so `from=9999-99-99` or `to=2026-02-30` answer 422 instead of being
 * ignored or matching nothing.
 */
export const isoDateSchema = (message = 'must be a real date like 2026-03-31') =>
  z.string().refine(isRealIsoDate, { message });
