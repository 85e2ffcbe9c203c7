/**
 * Which cohort is "current": the one running today (the latest to start when several overlap), else
 * the next to start, else the one that started last. Home, Record and the Classroom all call this, so
 * they agree. Dates are YYYY-MM-DD (UTC days); pure and browser-safe.
 */
export interface DatedCohort {
  id: number;
  startsOn: string;
  endsOn: string;
}

export function currentCohortOf<T extends DatedCohort>(cohorts: readonly T[], today: string): T | null {
  const byStart = [...cohorts].sort((a, b) => b.startsOn.localeCompare(a.startsOn) || b.id - a.id);
  return (
    byStart.find((c) => c.startsOn <= today && today <= c.endsOn) ??
    [...byStart].reverse().find((c) => c.startsOn > today) ??
    byStart.find((c) => c.startsOn <= today) ??
    null
  );
}

/** Today as a UTC day, YYYY-MM-DD. */
export function utcToday(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}
