import { LOGGER_LINE_TRAINING_DEFAULTS } from '@/lib/ingest/logger-line';
import { describe, expect, it, vi } from 'vitest';
import { fireEvent, render, screen } from '@testing-library/react';

// The grid's save is a server action; this test only reads what the grid shows and sends.
vi.mock('@/app/(lab)/record/actions', () => ({ saveManualRunAction: vi.fn() }));

const { ManualGrid } = await import('@/components/record/manual-grid');
const { manualEntrySchema } = await import('@/lib/record/manual-entry-schema');

// An invented 4-stud joint and a one-pass cross method.
const joint = { id: 1, name: 'Test joint', studCount: 4, targetLoadN: 2000, bandPercent: 10, maxStudLoadN: 1e6, maxStudLoadSource: 'test', calibration: [1, 1, 1, 1], stressAreaM2: null, youngsModulusPa: 205e9, loggerLine: LOGGER_LINE_TRAINING_DEFAULTS };
const method = { id: 1, name: 'Cross', checkPasses: 0, passes: [{ percentOfTarget: 100, orderByStudCount: { '4': [1, 3, 2, 4] } }] };
const header = { jointId: '1', methodId: '1', lubricantId: '1', operatorId: '1', cohortId: '', recordedAt: '2026-01-01T08:00', notes: '', hardwareSetId: '', lubricantLotId: '', gasketCondition: '' };

// Expected values: the decimal-comma rule of lib/format/parse-number.ts (issue 14, problem 7:
// "1,500" is fifteen hundred, as the calculator reads it; "1,5" is one and a half).
describe('ManualGrid', () => {
  it('reads "1,500" as 1500 (not 1.5) in the running mean and in what it sends', () => {
    render(<ManualGrid joint={joint} method={method as never} header={header} onHeaderErrors={() => {}} units="si" />);
    fireEvent.change(screen.getByLabelText('Unit on the display'), { target: { value: 'N' } });
    for (let stud = 1; stud <= 4; stud++) {
      fireEvent.change(screen.getByLabelText(`Step 1, stud ${stud}, N`), { target: { value: stud === 4 ? '1,5' : '1,500' } });
    }
    // Mean of 1500, 1500, 1500 and 1.5 N = 1125.375 N, shown to 3 significant figures (lib/calc/units.ts).
    expect(screen.getByText(/After step/)).toHaveTextContent('mean 1.13 kN');
    const payload = JSON.parse((document.querySelector('input[name="payload"]') as HTMLInputElement).value);
    expect(manualEntrySchema.parse(payload).rows[0]).toEqual([1500, 1500, 1500, 1.5]);
  });

  it('refuses an unclear cell with the reason and disables saving', () => {
    render(<ManualGrid joint={joint} method={method as never} header={header} onHeaderErrors={() => {}} units="si" />);
    fireEvent.change(screen.getByLabelText('Step 1, stud 1, kN'), { target: { value: '0,500' } });
    expect(screen.getByText(/Step 1, stud 1: .0,500. is unclear/)).toBeInTheDocument();
    expect(screen.getByLabelText('Step 1, stud 1, kN')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('button', { name: 'Save run' })).toBeDisabled();
  });

  it('lets a tensioner row name several studs with their applied loads, and sends them as the schema reads them', () => {
    // A 50 % coverage tensioner method on 4 studs: odd positions, then even (common practice). Invented loads.
    const tensioner = { ...method, toolKind: 'hydraulic_tensioner', tensionerCoverage: 'every_second_stud' };
    render(<ManualGrid joint={joint} method={tensioner as never} header={header} onHeaderErrors={() => {}} units="si" />);
    expect(screen.getByRole('complementary', { name: 'Caution' })).toHaveTextContent("follow the tool maker's instructions");
    const studs = screen.getByLabelText('Step 1, studs pulled') as HTMLInputElement;
    expect(studs.value).toBe('1 3');
    ['1.2', '0', '1.2', '0'].forEach((v, i) => fireEvent.change(screen.getByLabelText(`Step 1, stud ${i + 1}, kN`), { target: { value: v } }));
    fireEvent.change(screen.getByLabelText('Step 1, stud 1, applied, kN'), { target: { value: '1.38' } });
    fireEvent.change(screen.getByLabelText('Step 1, stud 3, applied, kN'), { target: { value: '1.4' } });
    const payload = manualEntrySchema.parse(JSON.parse((document.querySelector('input[name="payload"]') as HTMLInputElement).value));
    expect(payload.pulls?.[0]).toEqual({ studs: '1 3', applied: [1.38, null, 1.4, null] });
    expect(payload.pulls?.[1]?.studs).toBe('2 4');
    // A stud named twice is refused at once, and the run cannot be saved.
    fireEvent.change(studs, { target: { value: '1 3 3' } });
    expect(screen.getByText('Step 1, studs pulled: stud 3 is named twice.')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Save run' })).toBeDisabled();
  });
});
