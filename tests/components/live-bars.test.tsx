/**
 * The live bars on Stream live: each stud's latest load against the run's target and band. Band
 * limits worked out here: target 80 kN ± 10 % → 72 kN to 88 kN (80 × 0.9, 80 × 1.1).
 */
import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import { LiveBars } from '@/components/record/live-bars';

const latest = [
  { position: 1, loadN: 70_000 }, // below 72 kN
  { position: 2, loadN: 80_000 }, // on target
  { position: 3, loadN: 88_000 }, // on the upper limit: inside
  { position: 4, loadN: 92_000 }, // above 88 kN
];

describe('LiveBars', () => {
  it('states the target, the band limits and how many studs are inside', () => {
    render(<LiveBars latest={latest} targetLoadN={80_000} bandPercent={10} units="si" />);
    const caption = screen.getByTestId('live-band');
    expect(caption).toHaveTextContent(/Target 80\.0 kN, band ±10\.0 %: 72\.0 kN to 88\.0 kN · 2 of 4 studs in the band/);
  });

  it('names each stud below, in or above the band', () => {
    render(<LiveBars latest={latest} targetLoadN={80_000} bandPercent={10} units="si" />);
    expect(screen.getByLabelText('Stud 1: 70.0 kN, below the band')).toBeInTheDocument();
    expect(screen.getByLabelText('Stud 3: 88.0 kN, in the band')).toBeInTheDocument();
    expect(screen.getByLabelText('Stud 4: 92.0 kN, above the band')).toBeInTheDocument();
  });

  it('draws the target line and the band shade at their share of the scale', () => {
    render(<LiveBars latest={latest} targetLoadN={80_000} bandPercent={10} units="si" />);
    // Scale = max(88 kN × 1.15, 92 kN) = 101.2 kN: target at 80 / 101.2, band from 72 / 101.2.
    const target = screen.getAllByTestId('target-line')[0]!;
    expect(parseFloat(target.style.left)).toBeCloseTo((80 / 101.2) * 100, 6);
    const shade = screen.getAllByTestId('band-shade')[0]!;
    expect(parseFloat(shade.style.left)).toBeCloseTo((72 / 101.2) * 100, 6);
  });

  it('shows nothing before the first reading', () => {
    const { container } = render(<LiveBars latest={[]} targetLoadN={80_000} bandPercent={10} units="si" />);
    expect(container).toBeEmptyDOMElement();
  });
});
