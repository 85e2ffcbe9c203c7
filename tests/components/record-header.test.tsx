import { LOGGER_LINE_TRAINING_DEFAULTS } from '@/lib/ingest/logger-line';
import { describe, expect, it, vi } from 'vitest';
import { fireEvent, render, screen } from '@testing-library/react';
import type { RecordOptions } from '@/lib/data/record';

// The Record page's server actions; this test reads what the header shows and what is remembered.
const saveRecordPreferencesAction = vi.fn(async () => ({ status: 'ok', message: 'Remembered.' }));
vi.mock('@/app/(lab)/record/actions', () => ({ saveRecordPreferencesAction, saveManualRunAction: vi.fn(), saveSimulatedRunAction: vi.fn(), startRecordingAction: vi.fn(), finishRecordingAction: vi.fn(), createStreamTokenAction: vi.fn(), revokeStreamTokenAction: vi.fn() }));
const { RecordTabs } = await import('@/components/record/record-tabs');

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
// Invented cohorts around today: an old one listed first, the running one, and a trainee's past one.
const options: RecordOptions = {
  joints: [{ id: 1, name: 'J1', studCount: 4, targetLoadN: 2000, bandPercent: 10, maxStudLoadN: 1e6, maxStudLoadSource: 'test', calibration: [1, 1, 1, 1], stressAreaM2: null, youngsModulusPa: 205e9, loggerLine: LOGGER_LINE_TRAINING_DEFAULTS }],
  methods: [{ id: 1, name: 'Cross', checkPasses: 0, passes: [{ percentOfTarget: 100, pattern: 'cross', orderByStudCount: { '4': [1, 3, 2, 4] } }] }] as never,
  lubricants: [{ id: 1, name: 'Oil' }, { id: 2, name: 'Copper' }],
  cohorts: [
    { id: 10, name: 'Spring course', startsOn: day(-200), endsOn: day(-190) },
    { id: 11, name: 'This week', startsOn: day(-2), endsOn: day(3) },
    { id: 12, name: 'Autumn course', startsOn: day(-100), endsOn: day(-90) },
  ],
  operators: [
    { id: 1, name: 'Ines Instructor', cohortIds: [10, 11, 12] },
    { id: 2, name: 'Tom Trainee', cohortIds: [10, 12] },
  ],
  rememberedMappings: [],
  hardwareSets: [],
  lubricantLots: [],
};
const user = { id: 1, role: 'instructor', units: 'si' as const };

describe('Record header', () => {
  it('starts in the current cohort (the one running today), not the first listed', () => {
    render(<RecordTabs options={options} tokens={[]} recordings={[]} user={user} preferences={{ wayIn: 'simulate' }} />);
    expect(screen.getByLabelText('Cohort')).toHaveValue('11');
  });

  it('says what it changed and why when the operator is not in the chosen cohort', () => {
    render(<RecordTabs options={options} tokens={[]} recordings={[]} user={user} preferences={{ wayIn: 'simulate' }} />);
    fireEvent.change(screen.getByLabelText('Operator'), { target: { value: '2' } });
    // Tom's cohorts have both ended; the latest to start is the autumn course.
    expect(screen.getByLabelText('Cohort')).toHaveValue('12');
    expect(screen.getByTestId('cohort-note')).toHaveTextContent('Cohort changed to “Autumn course”: Tom Trainee is not in “This week”.');
    fireEvent.change(screen.getByLabelText('Cohort'), { target: { value: '10' } });
    expect(screen.getByTestId('cohort-note')).toHaveTextContent('');
    fireEvent.change(screen.getByLabelText('Operator'), { target: { value: '1' } });
    expect(screen.getByLabelText('Cohort')).toHaveValue('10'); // Ines is in it: kept, nothing to say
    expect(screen.getByTestId('cohort-note')).toHaveTextContent('');
  });

  it('opens on the remembered way in and header, and remembers a new choice', () => {
    saveRecordPreferencesAction.mockClear();
    render(<RecordTabs options={options} tokens={[]} recordings={[]} user={user} preferences={{ wayIn: 'simulate', header: { lubricantId: 2, operatorId: 2 } }} />);
    expect(screen.getByRole('tab', { name: 'Simulate' })).toHaveAttribute('aria-selected', 'true');
    expect(screen.getByLabelText('Lubricant')).toHaveValue('2');
    expect(screen.getByLabelText('Operator')).toHaveValue('2');
    fireEvent.click(screen.getByRole('tab', { name: 'Enter by hand' }));
    expect(saveRecordPreferencesAction).toHaveBeenCalledTimes(1);
    const sent = (saveRecordPreferencesAction.mock.calls[0] as unknown as [unknown, FormData])[1];
    expect(JSON.parse(String(sent.get('payload')))).toEqual({ wayIn: 'manual', header: { jointId: 1, methodId: 1, lubricantId: 2, operatorId: 2 } });
  });
});
