import { describe, expect, it } from 'vitest';
import { attemptKind, notAssessedReason, runSourceLine, type AttemptFacts } from '@/lib/qualification/attempt-kind';

// The rule of issue 17: only runs the cohort's instructor recorded (uploaded, streamed, by hand) or
// confirmed as witnessed are assessed attempts; simulated runs never; a trainee's own run is practice until confirmed.
const INSTRUCTOR = 10;
const TRAINEE = 20;
const OTHER_INSTRUCTOR = 30;
const facts = (over: Partial<AttemptFacts>): AttemptFacts => ({ source: 'upload', cohortInstructorId: INSTRUCTOR, recordedById: INSTRUCTOR, assessedConfirmedById: null, ...over });

describe('attemptKind', () => {
  it.each(['upload', 'manual', 'live'] as const)('counts a %s run the cohort’s instructor recorded as assessed', (source) => {
    expect(attemptKind(facts({ source }))).toBe('assessed');
  });

  it('never counts a simulated run, even one the instructor made and confirmed', () => {
    expect(attemptKind(facts({ source: 'simulated', assessedConfirmedById: INSTRUCTOR }))).toBe('simulated');
    expect(notAssessedReason(facts({ source: 'simulated' }))).toMatch(/simulated/);
  });

  it('counts a trainee-recorded run as practice until the cohort’s instructor confirms it', () => {
    expect(attemptKind(facts({ recordedById: TRAINEE }))).toBe('practice');
    expect(attemptKind(facts({ recordedById: TRAINEE, assessedConfirmedById: OTHER_INSTRUCTOR }))).toBe('practice');
    expect(attemptKind(facts({ recordedById: TRAINEE, assessedConfirmedById: INSTRUCTOR }))).toBe('assessed');
    expect(notAssessedReason(facts({ recordedById: TRAINEE }))).toMatch(/confirm/);
  });

  it('treats a run another instructor recorded, or a run outside a cohort, as practice', () => {
    expect(attemptKind(facts({ recordedById: OTHER_INSTRUCTOR }))).toBe('practice');
    expect(attemptKind(facts({ cohortInstructorId: null }))).toBe('practice');
    expect(attemptKind(facts({ recordedById: null }))).toBe('practice');
  });
});

describe('runSourceLine', () => {
  it('names the way in, who recorded it and who confirmed it', () => {
    expect(runSourceLine('manual', 'Ada Example', null)).toBe('Entered by hand by Ada Example');
    expect(runSourceLine('live', 'Ben Example', 'Cy Example')).toBe('Streamed live by Ben Example; confirmed as witnessed by Cy Example');
    expect(runSourceLine('simulated', null, null)).toBe('Simulated');
  });
});
