import { describe, expect, it } from 'vitest';
import { createRng } from '@/lib/sim/random';
import {
  barToPsi,
  formatArea,
  formatDecimals,
  formatInputValue,
  formatPercentFixed,
  formatForce,
  formatLength,
  formatNumber,
  formatPercent,
  formatPressure,
  formatStress,
  formatTorque,
  fromInputUnit,
  ftLbToNm,
  in2ToMm2,
  inToMm,
  ksiToMpa,
  lbfToN,
  mm2ToIn2,
  mmToIn,
  mpaToKsi,
  nmToFtLb,
  nToLbf,
  psiToBar,
  toInputUnit,
  type Quantity,
  type UnitSystem,
} from '@/lib/calc/units';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const SP = '\u00a0';

// The project's one seeded generator (lib/sim/random.ts), so a failure can be reproduced.
const rng = (seed: number) => createRng(seed).next;

describe('unit conversions', () => {
  it('use the exact defining factors (1 in = 25.4 mm, 1 lbf = 4.4482216152605 N: international yard and pound, 1959)', () => {
    expect(inToMm(1)).toBe(25.4);
    expect(lbfToN(1)).toBe(4.4482216152605);
    expect(in2ToMm2(1)).toBe(645.16);
    // 0.3048 m × 4.4482216152605 N = 1.3558179483314004 N·m (decimal product)
    expect(rel(ftLbToNm(1), 1.3558179483314004)).toBeLessThan(1e-15);
    // 1000 × 4.4482216152605 / 645.16 = 6.894757293168361 MPa per ksi (quotient)
    expect(rel(ksiToMpa(1), 1000 * 4.4482216152605 / 645.16)).toBeLessThan(1e-15);
    // 1 bar = 0.1 MPa; 0.1 / 0.006894757293168361 = 14.503773773 psi (computed from the above)
    expect(rel(barToPsi(1), 14.503773773)).toBeLessThan(1e-10);
  });

  it('round-trip random values to a relative 1e-12 for every quantity and system', () => {
    const next = rng(20260101);
    const pairs: [(x: number) => number, (x: number) => number][] = [
      [inToMm, mmToIn],
      [lbfToN, nToLbf],
      [ftLbToNm, nmToFtLb],
      [in2ToMm2, mm2ToIn2],
      [ksiToMpa, mpaToKsi],
      [barToPsi, psiToBar],
    ];
    const quantities: Quantity[] = ['length', 'area', 'force', 'stress', 'torque', 'pressure'];
    const systems: UnitSystem[] = ['si', 'us'];
    for (let i = 0; i < 500; i++) {
      const x = 10 ** (next() * 12 - 6) * (next() < 0.5 ? -1 : 1); // 1e-6 … 1e6, both signs
      for (const [to, back] of pairs) {
        expect(rel(back(to(x)), x)).toBeLessThan(1e-12);
        expect(rel(to(back(x)), x)).toBeLessThan(1e-12);
      }
      for (const q of quantities) {
        for (const s of systems) {
          expect(rel(fromInputUnit(q, toInputUnit(q, x, s), s), x)).toBeLessThan(1e-12);
        }
      }
    }
  });

  it('take force inputs in kN and pressure inputs in bar in SI', () => {
    expect(toInputUnit('force', 81_300, 'si')).toBeCloseTo(81.3, 12);
    expect(fromInputUnit('pressure', 1000, 'si')).toBeCloseTo(100, 12); // 1000 bar = 100 MPa
    expect(toInputUnit('length', 25.4, 'us')).toBe(1);
  });
});

describe('formatNumber', () => {
  it('rounds to significant figures but keeps whole units', () => {
    expect(formatNumber(17_535.2, 3)).toBe('17,535');
    expect(formatNumber(81.34, 3)).toBe('81.3');
    expect(formatNumber(0.14187, 3)).toBe('0.142');
    expect(formatNumber(0.14187, 4)).toBe('0.1419');
    expect(formatNumber(-2.5, 3)).toBe('-2.50');
    expect(formatNumber(0, 3)).toBe('0');
  });

  it('keeps the stated significant figures when rounding carries to the next power of ten', () => {
    expect(formatNumber(0.09996, 3)).toBe('0.100');
    expect(formatNumber(9.996, 3)).toBe('10.0');
  });

  it('shows an em dash for a non-finite value', () => {
    expect(formatNumber(Number.NaN)).toBe('—');
    expect(formatNumber(Infinity)).toBe('—');
  });
});

describe('format helpers', () => {
  it('put the unit beside the number with a no-break space', () => {
    expect(formatForce(81_300, 'si')).toBe(`81.3${SP}kN`);
    expect(formatForce(lbfToN(18_280), 'us')).toBe(`18,280${SP}lbf`);
    expect(formatForce(950, 'si')).toBe(`950${SP}N`);
    expect(formatForce(2_345_000, 'si')).toBe(`2.35${SP}MN`);
  });

  it('format torque, stress, pressure, area, length and percent in both systems', () => {
    expect(formatTorque(ftLbToNm(219.2), 'us')).toBe(`219${SP}ft-lb`);
    expect(formatTorque(352.5, 'si')).toBe(`353${SP}N·m`);
    expect(formatStress(ksiToMpa(105), 'us')).toBe(`105${SP}ksi`);
    expect(formatStress(ksiToMpa(105), 'si')).toBe(`724${SP}MPa`); // docs/REFERENCE.md §2: 105 ksi (724 MPa)
    expect(formatPressure(100, 'si')).toBe(`1,000${SP}bar`);
    expect(formatPressure(100, 'us')).toBe(`14,504${SP}psi`);
    expect(formatArea(in2ToMm2(0.3345), 'us')).toBe(`0.3345${SP}in²`);
    expect(formatArea(84.27, 'si')).toBe(`84.27${SP}mm²`);
    expect(formatLength(19.05, 'si')).toBe(`19.05${SP}mm`);
    expect(formatLength(19.05, 'us')).toBe(`0.7500${SP}in`);
    expect(formatPercent(50)).toBe(`50.0${SP}%`);
  });

  it('accept a number of significant figures', () => {
    expect(formatForce(81_313, 'si', { sig: 4 })).toBe(`81.31${SP}kN`);
  });
});

// Expected values: the decimal rounding of ECMA-402 Intl.NumberFormat (en-US grouping, half away
// from zero), worked by hand; these replace private toFixed/toLocaleString formatters.
describe('formatDecimals and formatPercentFixed', () => {
  it('rounds to fixed decimals with thousands separators', () => {
    expect(formatDecimals(1234.56, 1)).toBe('1,234.6');
    expect(formatDecimals(24.8, 2, 0)).toBe('24.8');
    expect(formatDecimals(69.5, 0)).toBe('70');
    expect(formatDecimals(0.9, 3)).toBe('0.900');
    expect(formatDecimals(Number.NaN, 1)).toBe('—');
  });

  it('writes percentages with a true minus sign, a plus on request, and no sign on a rounded zero', () => {
    expect(formatPercentFixed(97)).toBe('97.0\u00a0%');
    expect(formatPercentFixed(3, { signed: true })).toBe('+3.0\u00a0%');
    expect(formatPercentFixed(-3)).toBe('\u22123.0\u00a0%');
    expect(formatPercentFixed(-0.04, { signed: true })).toBe('0.0\u00a0%');
    expect(formatPercentFixed(12.375, { decimals: 2 })).toBe('12.38\u00a0%'); // 12.375 is exact in binary: a true tie
    expect(formatInputValue(1234.56789, 6)).toBe('1234.57');
  });
});
