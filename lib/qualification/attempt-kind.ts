/**
 * Which runs count as assessed attempts (pure, browser-safe).
 *
 * A run counts as an assessed attempt when an instructor of its cohort witnessed it: they recorded
 * it themselves (uploaded the logger file, streamed it live or entered it by hand), or they
 * confirmed afterwards a run the trainee recorded. A simulated run never counts; a run a trainee
 * records is practice until confirmed.
 */
import type { RunSource } from '@/models/run';

export type AttemptKind = 'assessed' | 'practice' | 'simulated';

export interface AttemptFacts {
  source: RunSource;
  cohortInstructorId: number | null;
  recordedById: number | null;
  assessedConfirmedById: number | null;
}

export function attemptKind(facts: AttemptFacts): AttemptKind {
  if (facts.source === 'simulated') return 'simulated';
  if (facts.cohortInstructorId === null) return 'practice';
  const witnessed = facts.recordedById === facts.cohortInstructorId || facts.assessedConfirmedById === facts.cohortInstructorId;
  return witnessed ? 'assessed' : 'practice';
}

/** Why a run is not an assessed attempt, as the sign-off refusal says it; null when it is one. */
export function notAssessedReason(facts: AttemptFacts): string | null {
  switch (attemptKind(facts)) {
    case 'assessed':
      return null;
    case 'simulated':
      return 'A simulated run is never an assessed attempt, so it cannot be signed off.';
    case 'practice':
      return facts.cohortInstructorId === null
        ? 'This run is not in a cohort, so it is practice and cannot be signed off.'
        : 'This run was recorded by the trainee, so it counts as practice. The cohort’s instructor must confirm they witnessed it before it can be signed off.';
  }
}

const WAY_IN: Record<RunSource, string> = {
  upload: 'Logger file uploaded',
  manual: 'Entered by hand',
  live: 'Streamed live',
  simulated: 'Simulated',
};

export const ATTEMPT_KIND_LABEL: Record<AttemptKind, string> = {
  assessed: 'Assessed attempt',
  practice: 'Practice',
  simulated: 'Simulated (never assessed)',
};

/** "Logger file uploaded by A. Person; witnessed: confirmed by B. Person" style source line for sheets and reports. */
export function runSourceLine(source: RunSource, recordedByName: string | null, confirmedByName: string | null): string {
  const way = `${WAY_IN[source]}${recordedByName ? ` by ${recordedByName}` : ''}`;
  return confirmedByName ? `${way}; confirmed as witnessed by ${confirmedByName}` : way;
}
