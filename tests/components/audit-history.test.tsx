import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import { AuditHistory } from '@/components/audit/audit-history';

// An invented checklist tick as lib/data/qualification/course-evidence.ts writes it.
const tick = {
  id: 1, at: '2026-11-02T09:30:00Z', actorName: 'Ines Instructor', objectType: 'checklist_tick', objectId: 7, action: 'tick', reason: null,
  before: null, after: { item: 'Lubrication', traineeId: 41, observed: true, note: null, byName: 'Ines Instructor' },
};

describe('AuditHistory', () => {
  it('names the action in words and lists what changed, without the ids kept for the export', () => {
    render(<AuditHistory entries={[tick]} />);
    expect(screen.getByText('Observed')).toBeTruthy();
    expect(screen.getByText('item: — → Lubrication')).toBeTruthy();
    expect(screen.getByText('observed: — → true')).toBeTruthy();
    expect(screen.queryByText(/traineeId/)).toBeNull();
  });

  it('falls back to the stored verb for an action it has no words for, and says when nothing is recorded', () => {
    const { unmount } = render(<AuditHistory entries={[{ ...tick, action: 'some_new_action' }]} />);
    expect(screen.getByText('some_new_action')).toBeTruthy();
    unmount();
    render(<AuditHistory entries={[]} />);
    expect(screen.getByText('No changes recorded yet.')).toBeTruthy();
  });
});
