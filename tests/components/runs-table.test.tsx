import { describe, expect, it, vi, beforeEach } from 'vitest';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { SWRConfig } from 'swr';

// The router and the address bar are Next's; this test records what the table asks of them.
const push = vi.fn();
const replace = vi.fn();
let search = new URLSearchParams();
vi.mock('next/navigation', () => ({
  useRouter: () => ({ push, replace }),
  usePathname: () => '/runs',
  useSearchParams: () => search,
}));
// An invented page of runs, in the shape GET /api/runs answers.
const runRow = { id: 42, recordedAt: '2026-11-02T09:00:00.000Z', jointName: 'J1', studCount: 8, methodName: 'Cross', lubricantName: 'Copper', operatorName: 'Ana', cohortName: null, source: 'manual', status: 'complete', passCount: 3, targetLoadN: 100000, finalMeanN: 99000, finalCv: 0.05 };
vi.mock('@/lib/http/fetch-json', () => ({ fetchJson: vi.fn(async () => ({ rows: [runRow], total: 45, page: 1, pageSize: 20 })) }));

const { RunsTable } = await import('@/components/runs/runs-table');
const options = { methods: [{ id: 3, name: 'Cross' }], lubricants: [], joints: [], cohorts: [], operators: [] };

function show() {
  return render(<SWRConfig value={{ provider: () => new Map() }}><RunsTable options={options} units="si" /></SWRConfig>);
}

beforeEach(() => {
  push.mockClear();
  replace.mockClear();
  search = new URLSearchParams();
});

describe('RunsTable', () => {
  it('pushes a history entry for a filter and for a page, so Back returns to the previous view', async () => {
    show();
    fireEvent.change(screen.getByLabelText('Method'), { target: { value: '3' } });
    expect(push).toHaveBeenLastCalledWith('/runs?methodId=3', { scroll: false });
    await screen.findByText('45 runs');
    fireEvent.click(screen.getByRole('button', { name: 'Next' }));
    expect(push).toHaveBeenLastCalledWith('/runs?page=2', { scroll: false });
    expect(replace).not.toHaveBeenCalled();
  });

  it('opens the report from anywhere in the row, and from Enter on the focused row; the date is a real link', async () => {
    show();
    const cell = await screen.findByText('Copper');
    fireEvent.click(cell);
    expect(push).toHaveBeenLastCalledWith('/runs/42');
    push.mockClear();
    const row = cell.closest('tr')!;
    expect(row).toHaveAttribute('tabindex', '0');
    fireEvent.keyDown(row, { key: ' ' });
    expect(push).not.toHaveBeenCalled();
    fireEvent.keyDown(row, { key: 'Enter' });
    expect(push).toHaveBeenLastCalledWith('/runs/42');
    expect(within(row).getByRole('link')).toHaveAttribute('href', '/runs/42');
  });

  it('marks every sortable header before it is active: aria-sort "none" and an icon', () => {
    show();
    const header = screen.getByRole('columnheader', { name: /CV/ });
    expect(header).toHaveAttribute('aria-sort', 'none');
    expect(header).toHaveTextContent('↕');
    expect(screen.getByRole('columnheader', { name: /Recorded/ })).toHaveAttribute('aria-sort', 'descending');
  });

  it('shows the filters in use as chips that remove their filter', () => {
    search = new URLSearchParams('methodId=3&from=2026-01-01');
    show();
    const chips = screen.getByRole('list', { name: 'Filters in use' });
    expect(within(chips).getAllByRole('button').map((b) => b.textContent)).toEqual(['Method: Cross ×', 'From: 2026-01-01 ×']);
    expect(screen.getByRole('button', { name: /^Filters \(2\)/ })).toHaveAttribute('aria-expanded', 'false');
    fireEvent.click(screen.getByRole('button', { name: 'Remove filter Method: Cross' }));
    expect(push).toHaveBeenLastCalledWith('/runs?from=2026-01-01', { scroll: false });
  });
});
