import { describe, expect, it, vi } from 'vitest';
import { render, screen, within } from '@testing-library/react';
import type { CohortDetail, CohortRunRow } from '@/lib/data/cohorts';

// The sign-off and send forms call server actions; this test only reads the lists.
vi.mock('@/app/(lab)/cohorts/actions', () => ({ signOffAction: vi.fn(), sendResultsAction: vi.fn(), resendInviteAction: vi.fn() }));
const { AwaitingVerdicts, MembersList } = await import('@/components/cohorts/cohort-lists');

// An invented cohort: 23 trainees with one complete unjudged run each, and 2 runs of the instructor (id 999).
const member = (id: number) => ({ id, name: `Trainee ${id}`, email: `t${id}@example.test`, employerContact: null, pending: id === 1, inviteExpired: false, isActive: true, attempts: 1, practiceRuns: 0, latestRunId: null, latestCv: null, latestMet: null, latestOf: null });
const run = (id: number, operatorId: number): CohortRunRow => ({
  id, recordedAt: '2026-11-02T09:00:00.000Z', operatorId, operatorName: `Person ${operatorId}`, methodName: 'Cross', jointName: 'J1', status: 'complete', finalCv: 0.04,
  judgement: { results: [], allMet: id % 2 === 0 }, verdict: null,
  attemptKind: 'assessed', sourceLine: 'Logger file uploaded by the instructor',
});
const members = Array.from({ length: 23 }, (_, i) => member(i + 1));
const cohort = {
  id: 7, name: 'C', site: 'S', startsOn: '2026-11-01', endsOn: '2026-11-30', instructorName: 'I', criteria: {} as never,
  members, runs: [...members.map((m) => run(100 + m.id, m.id)), run(500, 999), run(501, 999)],
} satisfies CohortDetail;
const hrefFor = (param: string, page: number) => `/cohorts/7?${param}=${page}#${param}`;

describe('cohort page lists', () => {
  it('folds the runs awaiting a verdict with their counts, leaves the instructor’s own runs out, and pages by 10', () => {
    const { container } = render(<AwaitingVerdicts cohort={cohort} pages={{}} hrefFor={hrefFor} />);
    const details = container.querySelector('details#awaiting')!;
    expect(details).not.toHaveAttribute('open');
    // 23 trainee runs; even ids 102…122 meet every criterion: 11 of them.
    expect(details.querySelector('summary')).toHaveTextContent('Runs awaiting a verdict (23)11 with every criterion met · 2 runs not by trainees of the cohort left out');
    expect(within(details as HTMLElement).getAllByRole('article', { hidden: true })).toHaveLength(10);
    expect(screen.queryByRole('article', { hidden: true, name: /Run 500/ })).toBeNull();
    expect(within(details as HTMLElement).getByText('Page 1 of 3')).toBeInTheDocument();
    expect(within(details as HTMLElement).getByRole('link', { hidden: true, name: 'Next' })).toHaveAttribute('href', '/cohorts/7?awaiting=2#awaiting');
  });

  it('opens on the page asked for, the last page holding the remaining 3', () => {
    const { container } = render(<AwaitingVerdicts cohort={cohort} pages={{ awaiting: 3 }} hrefFor={hrefFor} />);
    expect(container.querySelector('details#awaiting')).toHaveAttribute('open');
    expect(screen.getAllByRole('article')).toHaveLength(3);
    expect(screen.getByRole('link', { name: 'Previous' })).toHaveAttribute('href', '/cohorts/7?awaiting=2#awaiting');
  });

  it('folds a long member list with its count and pages it', () => {
    const { container } = render(<MembersList cohort={cohort} pages={{}} hrefFor={hrefFor} />);
    expect(container.querySelector('details#members')).not.toHaveAttribute('open');
    expect(container.querySelector('#members summary')).toHaveTextContent('Members (23)1 invited, password not set');
    expect(container.querySelectorAll('#members tbody tr')).toHaveLength(10);
  });
});
