/**
 * What stands behind a course outcome besides the decision: the witnessed practical attempts, the
 * theory result against the cohort's pass mark and the observation checklist (what the gauges cannot
 * see). Pure; stored per cohort and trainee by lib/data/qualification/course-evidence.ts.
 *
 * The rule for a pass (lib/data/qualification/course-outcomes.ts): when anything below is
 * outstanding, a pass is recorded only with an explicit override reason, stored and audited;
 * without one it is refused.
 */

/**
 * The starting list the instructor edits (common practice in the trade: what an instructor watches
 * for beside the loads; the cohort sets its own list).
 */
export const DEFAULT_CHECKLIST = [
  'Surface and thread preparation',
  'Lubrication',
  'Gasket placement',
  'Tool check',
  "Keeping clear of the tool's line of action",
] as const;

/** The theory pass mark in percent when the cohort sets none (training default: set your own; from memory, not a standard's figure). */
export const DEFAULT_THEORY_PASS_MARK = 70;

/** The theory rule: a score exactly at the pass mark passes (score ≥ mark). */
export const theoryPassed = (scorePercent: number, passMarkPercent: number): boolean => scorePercent >= passMarkPercent;

export interface OutcomeEvidence {
  /** Signed-off assessed attempts whose verdict met every criterion. */
  attemptsMet: number;
  theoryScore: number | null;
  theoryPassMark: number;
  /** The cohort's items in force (retired ones left out), each observed or not for this trainee. */
  checklist: ReadonlyArray<{ label: string; observed: boolean }>;
}

/** What is outstanding for a pass (empty when nothing is), in words for the instructor. */
export function outstandingItems(evidence: OutcomeEvidence): string[] {
  const items: string[] = [];
  if (evidence.attemptsMet === 0) items.push('No signed-off assessed attempt meets every criterion.');
  if (evidence.theoryScore === null) items.push('No theory result entered.');
  else if (!theoryPassed(evidence.theoryScore, evidence.theoryPassMark)) items.push(`The theory result (${evidence.theoryScore} %) is below the pass mark (${evidence.theoryPassMark} %).`);
  if (evidence.checklist.length === 0) items.push('The cohort has no observation checklist yet.');
  const missing = evidence.checklist.filter((item) => !item.observed).map((item) => item.label);
  if (missing.length) items.push(`Not yet observed: ${missing.join(', ')}.`);
  return items;
}

/** Lines of a textarea → a clean list (trimmed, blanks and repeats dropped, at most `max`). */
export function listFromLines(text: string, max = 12): string[] {
  return [...new Set(text.split(/\r?\n/).map((line) => line.trim().replace(/\s+/g, ' ')).filter(Boolean))].slice(0, max);
}
