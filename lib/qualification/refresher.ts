/**
 * Refresher reminders for records of training: when one is due and the key that makes it unique.
 * Pure; the scan and the mail live in lib/data/reminders.
 */

/**
 * 90 days' notice leaves a quarter to book a refresher course before a record lapses (chosen for the
 * demo; on screen: "training default: set your own").
 */
export const DEFAULT_REFRESHER_LEAD_DAYS = 90;
export const MAX_REFRESHER_LEAD_DAYS = 365;

const DAY_MS = 86_400_000;

/** The calendar day `days` days before `isoDate` (YYYY-MM-DD, UTC): 2029-03-01 less 1 day is 2029-02-28, in 2028 it is 2028-02-29. */
export function daysBefore(isoDate: string, days: number): string {
  const [year, month, day] = isoDate.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(year, month - 1, day) - days * DAY_MS).toISOString().slice(0, 10);
}

/** The day a record's refresher reminder is due: `leadDays` before its valid-until date. */
export function refresherDueOn(validUntil: string, leadDays: number): string {
  if (!Number.isInteger(leadDays) || leadDays < 0) throw new RangeError('refresherDueOn needs a whole number of days, 0 or more');
  return daysBefore(validUntil, leadDays);
}

/**
 * Whether a live record's reminder should be queued on `today`: its due day has come and the record
 * has not yet expired (a record valid until today still gets one; an expired one does not).
 */
export function refresherIsDue(validUntil: string, leadDays: number, today: string): boolean {
  return refresherDueOn(validUntil, leadDays) <= today && today <= validUntil;
}

/** One reminder per record and valid-until date: a reissued record (a new row, new dates) gets its own. */
export const refresherDedupeKey = (trainingRecordId: number, validUntil: string) => `refresher:${trainingRecordId}:${validUntil}`;
