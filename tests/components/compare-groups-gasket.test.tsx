import { describe, expect, it } from 'vitest';
import { render, screen, within } from '@testing-library/react';
import { CompareGroupsTable } from '@/components/compare/compare-groups-table';
import { compareGroups } from '@/lib/analysis/compare-groups';
import type { ComparedRun, GroupInput } from '@/lib/analysis/compare-types';

// Invented runs: group A's runs carry stored gasket figures of 40 and 60 MPa against a seating stress of
// 50 MPa; group B's joint has no gasket contact area. Hand-worked: A's mean = (40 + 60) / 2 = 50 MPa,
// 1 of 2 runs reaches seating = 50 %; in US units 50 MPa = 50 / 6.894757 ksi = 7.25 ksi (1 ksi = 6.894757 MPa, NIST SP 811).
const run = (loads: number[], gasket: ComparedRun['gasket']): ComparedRun => ({ targetLoadN: 100_000, finalLoadsN: loads, driftPercent: [], gasket });
const inputs: GroupInput[] = [
  { key: '1', label: 'Group A', runs: [run([99_000, 101_000, 100_000, 98_000], { stressMpa: 40, minSeatingMpa: 50 }), run([97_000, 103_000, 100_000, 101_000], { stressMpa: 60, minSeatingMpa: 50 })] },
  { key: '2', label: 'Group B', runs: [run([96_000, 104_000, 99_000, 100_000], null), run([98_000, 102_000, 101_000, 99_000], null)] },
];
const groups = compareGroups(inputs, { subject: 'these groups', planned: 'welch-ln-cv', blocks: false }).groups;

const cellOf = (label: string) => within(screen.getByText(label).closest('tr')!).getByTestId('group-gasket');

describe('CompareGroupsTable: gasket stress', () => {
  it('shows the mean gasket stress and the share seated for a group with gasket data, "no gasket data" for one without', () => {
    render(<CompareGroupsTable groups={groups} units="si" />);
    expect(screen.getByRole('columnheader', { name: /Gasket stress after the last pass/ })).toBeTruthy();
    expect(cellOf('Group A').textContent).toBe('50.0\u00a0MPa (2) · 50.0\u00a0% reach seating');
    expect(cellOf('Group B').textContent).toBe('no gasket data');
  });

  it('shows it in ksi for a US user', () => {
    render(<CompareGroupsTable groups={groups} units="us" />);
    expect(cellOf('Group A').textContent).toMatch(/^7\.25\u00a0ksi \(2\)/);
  });

  it('has no gasket column when no group has gasket data (and for comparisons saved before)', () => {
    const { gasket: _g, ...older } = groups[1]!;
    render(<CompareGroupsTable groups={[groups[1]!, { ...older, key: '3' }]} />);
    expect(screen.queryByRole('columnheader', { name: /Gasket stress/ })).toBeNull();
  });
});
