import { describe, expect, it } from 'vitest';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { CalculatorForm } from '@/components/calculator/calculator-form';

// The formatters put a no-break space before the unit; Testing Library's default normalizer turns it
// into a plain space, so the expected texts below use a plain space.
const SP = ' ';

describe('CalculatorForm', () => {
  it('shows results for the default 3/4-10 B7 stud at 50 % of yield', () => {
    render(<CalculatorForm />);
    const results = screen.getByRole('heading', { name: 'Results' }).closest('section')!;
    // As = 0.7854 (0.75 − 0.09743)² = 0.33446 in² = 215.8 mm² (formula [EE-B1.1], by hand).
    expect(within(results).getByText(`215.8${SP}mm²`)).toBeInTheDocument();
    // F = 0.5 × 724 MPa × 215.8 mm² = 78.1 kN (by hand)
    expect(within(results).getByText(`78.1${SP}kN`)).toBeInTheDocument();
    expect(screen.getByRole('status', { name: 'Warnings' })).toHaveTextContent('No warnings');
    expect(screen.getByRole('complementary', { name: 'Caution' })).toHaveTextContent('stud, flange and gasket limits');
    expect(screen.getByTestId('tensioner-caution')).toHaveTextContent('line of action');
  });

  it('keeps each result value whole on one line: it may break only between two values at the "·"', () => {
    render(<CalculatorForm />);
    const results = screen.getByRole('heading', { name: 'Results' }).closest('section')!;
    const values = [...results.querySelectorAll('dd')].filter((dd) => /\d/.test(dd.firstChild?.textContent ?? ''));
    expect(values.length).toBeGreaterThanOrEqual(6);
    for (const dd of values) {
      const parts = [...dd.querySelectorAll('[data-value-part]')];
      expect(parts.length, dd.textContent ?? '').toBeGreaterThan(0);
      for (const part of parts) expect(part).toHaveClass('whitespace-nowrap');
      // Nothing of the value outside a no-wrap part but the separators (and the note below it).
      const note = dd.querySelector('.block')?.textContent ?? '';
      expect((dd.textContent ?? '').replace(note, '').split(' · ')).toEqual(parts.map((p) => p.textContent));
    }
  });

  it('converts values exactly when the units are switched, and back', () => {
    render(<CalculatorForm />);
    const od = screen.getByLabelText('Nut bearing diameter (across flats)') as HTMLInputElement;
    const clamp = screen.getByLabelText('Clamped length (L)') as HTMLInputElement;
    // Heavy-hex 3/4 in: 1.25 in across flats = 31.75 mm (1 in = 25.4 mm exactly).
    expect(od.value).toBe('31.75');
    expect(clamp.value).toBe('76.2');
    fireEvent.click(screen.getByLabelText('US customary (in, lbf, ksi, ft-lb)'));
    expect(od.value).toBe('1.25');
    expect(clamp.value).toBe('3');
    expect(screen.getByText(`0.3345${SP}in²`)).toBeInTheDocument();
    // F = 0.5 × 105 ksi × 0.33446 in² = 17,559 lbf (by hand)
    expect(screen.getByText(`17,559${SP}lbf`)).toBeInTheDocument();
    fireEvent.click(screen.getByLabelText('SI (mm, kN, MPa, N·m)'));
    expect(od.value).toBe('31.75');
  });

  it('converts a typed value on a unit switch', () => {
    render(<CalculatorForm />);
    const clamp = screen.getByLabelText('Clamped length (L)') as HTMLInputElement;
    fireEvent.change(clamp, { target: { value: '100' } });
    fireEvent.click(screen.getByLabelText('US customary (in, lbf, ksi, ft-lb)'));
    // 100 mm / 25.4 = 3.937008 in (7 significant figures)
    expect(clamp.value).toBe('3.937008');
  });

  it('says in a sentence beside the field what is wrong with a bad threads-per-inch value', () => {
    render(<CalculatorForm />);
    fireEvent.change(screen.getByLabelText('Thread'), { target: { value: 'custom' } });
    const tpi = screen.getByLabelText('Threads per inch') as HTMLInputElement;
    expect(tpi.value).toBe('10');
    fireEvent.change(tpi, { target: { value: '50' } });
    expect(tpi).toHaveAttribute('aria-invalid', 'true');
    expect(tpi).toHaveAccessibleDescription(expect.stringContaining('Threads per inch must be between 4 and 40.'));
    expect(screen.getAllByText('fix the inputs').length).toBeGreaterThan(0);
  });

  it('sets K from the lubricant choice and warns at a high target', () => {
    render(<CalculatorForm />);
    fireEvent.change(screen.getByLabelText('Lubricant or finish'), { target: { value: 'anti-seize' } });
    expect((screen.getByLabelText('Nut factor (K)') as HTMLInputElement).value).toBe('0.12');
    fireEvent.change(screen.getByLabelText('Target, % of yield'), { target: { value: '80' } });
    expect(screen.getByRole('status', { name: 'Warnings' })).toHaveTextContent('above the 40–70 % range this calculator uses as its training default');
  });

  it('works from a target gasket stress to the stud load and back from the target preload, in SI and US units', () => {
    render(<CalculatorForm />);
    const load = screen.getByTestId('gasket-stud-load');
    const back = screen.getByTestId('gasket-stress-at-preload');
    // Ring 4.5 in × 5.5 in = 114.3 mm × 139.7 mm: A = π/4 (139.7² − 114.3²) = 5,067 mm² (area of an annulus, by hand).
    // 69 MPa (docs/REFERENCE.md §7) × 5,067 mm² / 8 studs = 43,703 N = 43.7 kN each (stress = force / area, by hand).
    expect(load).toHaveTextContent(`43.7${SP}kN each`);
    // Back: 8 × 78.1 kN (the target preload above) / 5,067 mm² = 123 MPa (by hand).
    expect(back).toHaveTextContent(`123${SP}MPa`);
    fireEvent.click(screen.getByLabelText('US customary (in, lbf, ksi, ft-lb)'));
    fireEvent.change(screen.getByLabelText(/^Target gasket stress/), { target: { value: '10' } });
    // 10,000 psi × 2.5π in² / 8 = 9,817 lbf each; back: 8 × 17,559 lbf / 7.854 in² = 17,886 psi = 17.9 ksi (by hand).
    expect(load).toHaveTextContent(`9,817${SP}lbf each`);
    expect(back).toHaveTextContent(`17.9${SP}ksi`);
  });

  it('says what is wrong with a gasket outer diameter below the inner', () => {
    render(<CalculatorForm />);
    fireEvent.change(screen.getByLabelText(/^Gasket contact outer diameter/), { target: { value: '100' } });
    expect(screen.getByText('The outer contact diameter must be larger than the inner.')).toBeInTheDocument();
    expect(screen.getByTestId('gasket-stud-load')).toHaveTextContent('—');
  });
});
