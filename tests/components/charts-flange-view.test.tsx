import { describe, expect, it } from 'vitest';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { FlangeView } from '@/components/charts/flange-view';

const NBSP = '\u00a0';
const loads12 = Array.from({ length: 12 }, (_, i) => 50_000 + (i - 6) * 500);

function studCentres(container: HTMLElement) {
  return [...container.querySelectorAll('[data-position]')].map((g) => {
    const c = g.querySelector('[data-testid="stud"]')!;
    return { position: Number(g.getAttribute('data-position')), x: Number(c.getAttribute('cx')), y: Number(c.getAttribute('cy')) };
  });
}

describe('FlangeView', () => {
  it.each([8, 12, 16])('draws %i studs numbered clockwise from the top', (n) => {
    const { container } = render(
      <FlangeView loadsN={Array(n).fill(50_000)} targetN={50_000} bandPercent={5} units="si" label={`Flange, ${n} studs`} />,
    );
    expect(within(screen.getByRole('group', { name: `Flange, ${n} studs` })).getAllByRole('img')).toHaveLength(n);
    const c = studCentres(container);
    const top = c.reduce((a, b) => (b.y < a.y ? b : a));
    const right = c.reduce((a, b) => (b.x > a.x ? b : a));
    const bottom = c.reduce((a, b) => (b.y > a.y ? b : a));
    expect(top.position).toBe(1);
    expect(right.position).toBe(n / 4 + 1); // clockwise: a quarter turn from the top is 3 o'clock
    expect(bottom.position).toBe(n / 2 + 1);
    // Stud 2 lies right of stud 1 (clockwise on screen), stud n to its left.
    expect(c[1]!.x).toBeGreaterThan(c[0]!.x);
    expect(c[n - 1]!.x).toBeLessThan(c[0]!.x);
  });

  it('labels each stud with its load in the user units, % of target and deviation', () => {
    render(<FlangeView loadsN={[51_200, 48_500, 50_000, 53_000]} targetN={52_800} bandPercent={5} units="si" label="Flange" />);
    // 51 200 / 52 800 = 96.97 % → "97.0 %", 3.0 % below.
    expect(screen.getByRole('img', { name: `Stud 1: 51.2${NBSP}kN, 97.0${NBSP}% of target, 3.0${NBSP}% below` })).toBeInTheDocument();
    expect(screen.getByRole('img', { name: `Stud 4: 53.0${NBSP}kN, 100.4${NBSP}% of target, 0.4${NBSP}% above` })).toBeInTheDocument();
  });

  it('uses lbf for US units (1 lbf = 4.4482216152605 N)', () => {
    render(<FlangeView loadsN={[50_000, 50_000, 50_000, 50_000]} targetN={50_000} bandPercent={5} units="us" label="Flange" />);
    expect(screen.getByRole('img', { name: `Stud 1: 11,240${NBSP}lbf, 100.0${NBSP}% of target, on target` })).toBeInTheDocument();
  });

  it('shows the reading on focus and on hover, hides it on blur and Escape', () => {
    render(<FlangeView loadsN={loads12} targetN={50_000} bandPercent={5} units="si" label="Flange" />);
    expect(screen.queryByRole('tooltip')).toBeNull();
    const stud3 = screen.getByRole('img', { name: /^Stud 3:/ });
    expect(stud3).toHaveAttribute('tabindex', '0');
    fireEvent.focus(stud3);
    const tip = screen.getByRole('tooltip');
    // Stud 3: 50 000 + (2 − 6) × 500 = 48 000 N = 48.0 kN, 96.0 % of target.
    expect(tip).toHaveTextContent('Stud 3');
    // toHaveTextContent folds the no-break space into a plain space.
    expect(tip).toHaveTextContent('48.0 kN');
    expect(tip).toHaveTextContent('96.0 % of target · 4.0 % below');
    fireEvent.blur(stud3);
    expect(screen.queryByRole('tooltip')).toBeNull();
    fireEvent.focus(stud3);
    expect(screen.getByRole('tooltip')).toHaveTextContent('Stud 3');
    fireEvent.keyDown(stud3, { key: 'Escape' });
    expect(screen.queryByRole('tooltip')).toBeNull();
    fireEvent.mouseEnter(screen.getByRole('img', { name: /^Stud 7:/ }));
    expect(screen.getByRole('tooltip')).toHaveTextContent('Stud 7');
    fireEvent.mouseLeave(screen.getByRole('img', { name: /^Stud 7:/ }));
    expect(screen.queryByRole('tooltip')).toBeNull();
    expect(stud3.querySelector('title')?.textContent).toBe(stud3.getAttribute('aria-label'));
  });

  it('fills studs by deviation and outlines the active stud in the accent colour', () => {
    const { container } = render(
      <FlangeView loadsN={[40_000, 50_000, 60_000, 50_000]} targetN={50_000} bandPercent={10} units="si" activePosition={2} label="Flange" />,
    );
    const fills = [...container.querySelectorAll('[data-testid="stud"]')].map((c) => (c as SVGElement).style.fill);
    expect(fills[0]).toBe('var(--el-below)'); // −20 % = −2 × band: saturated
    expect(fills[1]).toBe('var(--el-on)');
    expect(fills[2]).toBe('var(--el-above)');
    const ring = container.querySelector('[data-testid="active-ring"]') as SVGElement;
    expect(ring.closest('[data-position]')).toHaveAttribute('data-position', '2');
    expect(ring.style.stroke).toBe('var(--el-accent)');
  });

  it('draws bigger for a projector and carries the deviation legend with band ticks', () => {
    render(<FlangeView loadsN={loads12} targetN={50_000} bandPercent={5} units="si" size={640} label="Flange" />);
    expect(screen.getByRole('group', { name: 'Flange' })).toHaveAttribute('width', '640');
    const legend = screen.getByRole('group', { name: /Colour scale/ });
    expect(legend).toHaveTextContent('below target');
    expect(legend).toHaveTextContent('on target');
    expect(legend).toHaveTextContent('above target');
    expect(within(legend).getAllByTestId('deviation-tick').map((t) => t.textContent)).toEqual([
      `−10${NBSP}%`, `−5${NBSP}%`, `0${NBSP}%`, `+5${NBSP}%`, `+10${NBSP}%`,
    ]);
  });
});
