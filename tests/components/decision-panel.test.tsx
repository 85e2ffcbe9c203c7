import { describe, expect, it, vi } from 'vitest';
import { render, screen, within } from '@testing-library/react';
import type { CourseEvidenceDto } from '@/lib/data/qualification/course-evidence';
import { DEFAULT_CHECKLIST, outstandingItems } from '@/lib/qualification/course-outcome';

// The decision form posts a server action; this test reads what the panel shows.
vi.mock('@/app/(lab)/cohorts/[id]/trainees/[userId]/actions', () => ({ decideOutcomeAction: vi.fn(), recordValidityAction: vi.fn() }));
const { DecisionPanel } = await import('@/components/qualification/decision-panel');

// An invented trainee: two witnessed attempts (one signed off, not every criterion met), theory 65 % against 70 %, 3 of 5 items observed.
const checklist = DEFAULT_CHECKLIST.map((label, i) => ({
  id: i + 1, label, retired: false,
  tick: i < 3 ? { id: 10 + i, observed: true, byName: 'Ines Instructor', at: '2026-12-02T10:00:00.000Z', note: null, version: 1 } : null,
}));
const evidenceOf = (over: Partial<CourseEvidenceDto>): CourseEvidenceDto => {
  const base = { passMark: 70, passMarkIsDefault: true, theory: { id: 1, scorePercent: 65, takenOn: '2026-12-02', enteredByName: 'Ines Instructor', enteredAt: '2026-12-02T11:00:00.000Z', passed: false, version: 1 }, checklist, attemptsMet: 0, outstanding: [] as string[] };
  const merged = { ...base, ...over };
  const inForce = merged.checklist.filter((e) => !e.retired).map((e) => ({ label: e.label, observed: e.tick?.observed ?? false }));
  return { ...merged, outstanding: outstandingItems({ attemptsMet: merged.attemptsMet, theoryScore: merged.theory?.scorePercent ?? null, theoryPassMark: merged.passMark, checklist: inForce }) };
};
const attempts = [
  { runId: 5, recordedAt: '2026-12-01T09:00:00.000Z', methodName: 'Cross, three passes', verdict: { allMet: false, signedByName: 'Ines Instructor', signedAt: '2026-12-01T12:00:00.000Z' } },
  { runId: 6, recordedAt: '2026-12-02T09:00:00.000Z', methodName: 'Cross, three passes', verdict: null },
];

describe('DecisionPanel', () => {
  it('shows the attempts with their verdicts, theory against the pass mark, the checklist and what is outstanding, and asks for an override reason', () => {
    render(<DecisionPanel cohortId={1} traineeId={2} outcome={null} evidence={evidenceOf({})} attempts={attempts} />);
    const list = screen.getByRole('list', { name: 'Witnessed practical attempts' });
    expect(within(list).getAllByRole('listitem')[0]).toHaveTextContent(/Attempt 1 .* Cross, three passes: signed off by Ines Instructor on .*: not every criterion met/);
    expect(within(list).getAllByRole('listitem')[1]).toHaveTextContent(/Attempt 2 .*: not signed off yet/);
    expect(screen.getByTestId('theory-summary')).toHaveTextContent('Not yet: 65 % against the pass mark of 70 %');
    expect(screen.getByTestId('checklist-summary')).toHaveTextContent('3 of 5 observed');
    expect(screen.getByText(`Outstanding: Tool check, Keeping clear of the tool's line of action`)).toBeInTheDocument();
    const note = screen.getByRole('note');
    expect(within(note).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'No signed-off assessed attempt meets every criterion.',
      'The theory result (65 %) is below the pass mark (70 %).',
      `Not yet observed: Tool check, Keeping clear of the tool's line of action.`,
    ]);
    expect(screen.getByRole('textbox', { name: /Reason for a pass with something outstanding/ })).toBeInTheDocument();
    expect(screen.getByText('No decision yet.')).toBeInTheDocument();
  });

  it('says nothing is outstanding and asks for no reason when the evidence is complete; shows a recorded override', () => {
    const observedAll = checklist.map((e) => ({ ...e, tick: { id: 20 + e.id, observed: true, byName: 'Ines Instructor', at: '2026-12-02T10:00:00.000Z', note: null, version: 1 } }));
    const complete = evidenceOf({ attemptsMet: 1, theory: { id: 1, scorePercent: 70, takenOn: '2026-12-02', enteredByName: 'Ines Instructor', enteredAt: '2026-12-02T11:00:00.000Z', passed: true, version: 1 }, checklist: observedAll });
    const outcome = { id: 3, decision: 'pass' as const, scopes: ['Hand torque'], decidedByName: 'Ines Instructor', decidedAt: '2026-12-03T09:00:00.000Z', version: 2, overrideReason: 'Watched again on the joint' };
    render(<DecisionPanel cohortId={1} traineeId={2} outcome={outcome} evidence={complete} attempts={attempts} />);
    expect(screen.getByText('Nothing outstanding for a pass.')).toBeInTheDocument();
    expect(screen.queryByRole('note')).toBeNull();
    expect(screen.queryByRole('textbox', { name: /Reason for a pass/ })).toBeNull();
    // 70 % against 70 %: exactly at the mark passes (the rule in lib/qualification/course-outcome.ts).
    expect(screen.getByTestId('theory-summary')).toHaveTextContent('Passed: 70 % against the pass mark of 70 %');
    expect(screen.getByTestId('outcome-summary')).toHaveTextContent('Pass · Hand torque · decided by Ines Instructor');
    expect(screen.getByTestId('outcome-summary')).toHaveTextContent('override: “Watched again on the joint”');
  });
});
