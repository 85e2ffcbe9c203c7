/**
 * The course outcome's pieces besides the attempts: a theory result against a pass mark, the
 * observation checklist (what the gauges cannot see) and the scopes. Pure; stored per cohort and
 * trainee by lib/data/qualification/course-outcomes.ts.
 */

/** What an instructor watches for beside the loads (common practice in the trade; the cohort sets its own list). */
export const DEFAULT_CHECKLIST = [
  'Surface and thread preparation',
  'Lubrication',
  'Gasket placement',
  'Tool check',
  "Keeping clear of the tool's line of action",
] as const;

/** The theory pass mark in percent (training default: set your own). */
export const DEFAULT_THEORY_PASS_MARK = 70;

export interface CourseSettings {
  theoryPassMark: number;
  checklist: string[];
  scopes: string[];
}

export interface OutcomeEvidence {
  theoryScore: number | null;
  observed: string[];
}

/** Why a pass cannot be recorded yet (empty when it can): the theory result and every checklist item. */
export function passBlockers(evidence: OutcomeEvidence, settings: CourseSettings): string[] {
  const blockers: string[] = [];
  if (evidence.theoryScore === null) blockers.push('Enter the theory result.');
  else if (evidence.theoryScore < settings.theoryPassMark) blockers.push(`The theory result (${evidence.theoryScore} %) is below the pass mark (${settings.theoryPassMark} %).`);
  const missing = settings.checklist.filter((item) => !evidence.observed.includes(item));
  if (missing.length) blockers.push(`Not yet observed: ${missing.join(', ')}.`);
  return blockers;
}

/** Lines of a textarea → a clean list (trimmed, blanks and repeats dropped, at most `max`). */
export function listFromLines(text: string, max = 12): string[] {
  return [...new Set(text.split(/\r?\n/).map((line) => line.trim().replace(/\s+/g, ' ')).filter(Boolean))].slice(0, max);
}
