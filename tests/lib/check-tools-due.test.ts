import { describe, expect, it } from 'vitest';
import { checkToolsDue, withToolReason } from '@/lib/run-check/check-tools-due';

// The rule: a tool due before the run's day, or never calibrated, holds the run; due on the day
// itself is still in date (the register's "due" date is the last day of validity, common practice).
describe('tools in date on the run\'s day', () => {
  const wrench = { id: 1, name: 'Wrench 12', dueOn: '2026-06-15' };
  const pump = { id: 2, name: 'Pump gauge', dueOn: '2026-06-14' };
  const cell = { id: 3, name: 'Load cell', dueOn: null };

  it('passes a tool due on the run\'s day and holds one due the day before, naming it and its date', () => {
    expect(checkToolsDue([wrench], '2026-06-15')).toBeNull();
    const reason = checkToolsDue([wrench, pump], '2026-06-15');
    expect(reason?.rule).toBe('tool_past_due');
    expect(reason?.message).toContain('Pump gauge (due 2026-06-14)');
    expect(reason?.message).not.toContain('Wrench 12');
  });

  it('holds a tool with no calibration on record and says so', () => {
    expect(checkToolsDue([cell], '2026-01-01')?.message).toMatch(/^Load cell \(no calibration on record\) was past calibration/);
    expect(checkToolsDue([cell, pump], '2026-06-15')?.message).toMatch(/ were past calibration/);
  });

  it('replaces only the tool reason among a run\'s reasons', () => {
    const passes = { rule: 'passes' as const, message: 'Two passes where the method has four.' };
    const late = checkToolsDue([pump], '2026-06-15')!;
    expect(withToolReason([passes], late)).toEqual([passes, late]);
    expect(withToolReason([passes, late], null)).toEqual([passes]);
    expect(withToolReason([late, passes], { ...late, message: 'changed' })).toEqual([passes, { ...late, message: 'changed' }]);
  });
});
