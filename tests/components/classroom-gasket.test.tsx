import { describe, expect, it } from 'vitest';
import { render, screen, within } from '@testing-library/react';
import { GasketPassStress } from '@/components/classroom/gasket-pass-stress';
import type { BuiltScene } from '@/components/classroom/scene-model';
import type { RunAnalysis } from '@/lib/analysis/types';

// An invented scene: 10,000 mm² contact, seating 10 MPa, maximum 20 MPa. Side A ends pass 1 with
// 4 × 15,000 N (6 MPa, below seating) and pass 2 with 4 × 30,000 N (12 MPa, within); hand-worked.
// In US units 12 MPa = 12 / 6.894757 ksi = 1.74 ksi (1 ksi = 6.894757 MPa, NIST SP 811).
const pass = (n: number, load: number) => ({ pass: n, percentOfTarget: null, loadsAfterN: Array(4).fill(load), meanLossPercent: 0, cv: 0 });
const analysis = { passes: [pass(1, 15_000), pass(2, 30_000)] } as unknown as RunAnalysis;
const scene = {
  key: 'passes', title: 'One pass or several', sides: [{ key: 'a', label: 'Side A', caption: '', analysis, real: false }], totalSteps: 8, figures: null,
  problems: [], saveable: true, jointId: 1, targetLoadN: 30_000, bandPercent: 10,
  gasket: { areaMm2: 10_000, minSeatingMpa: 10, maxMpa: 20, source: 'training default: set your own' },
} as BuiltScene;

describe('GasketPassStress (classroom)', () => {
  it('shows the average gasket stress after each pass against seating and maximum, with the caution', () => {
    render(<GasketPassStress scene={scene} units="si" />);
    const rows = within(screen.getByTestId('classroom-gasket')).getAllByRole('row').slice(1).map((r) => r.textContent);
    expect(rows).toEqual(['Pass 16.00\u00a0MPa below seating', 'Pass 212.0\u00a0MPa within limits']);
    const text = screen.getByTestId('classroom-gasket').textContent;
    expect(text).toContain('Limits: seating 10.0\u00a0MPa, maximum 20.0\u00a0MPa (training default: set your own).');
    expect(text).toContain('crushes it');
  });

  it('uses ksi for a US user, and shows nothing for a joint without a gasket contact area', () => {
    const { unmount } = render(<GasketPassStress scene={scene} units="us" />);
    expect(screen.getByTestId('classroom-gasket').textContent).toContain('1.74\u00a0ksi within limits');
    unmount();
    const { container } = render(<GasketPassStress scene={{ ...scene, gasket: null }} units="si" />);
    expect(container.textContent).toBe('');
  });
});
