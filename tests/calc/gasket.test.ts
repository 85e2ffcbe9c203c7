import { describe, expect, it } from 'vitest';
import { gasketContactArea, gasketStress, gasketStressLevel, gasketStressSummary, positionGasketStresses, studLoadForGasketStress } from '@/lib/calc/gasket';
import { in2ToMm2, inToMm, lbfToN, mpaToPsi, nToLbf, psiToMpa } from '@/lib/calc/units';

// Formulas: area of an annulus A = π/4 (Do² − Di²) (geometry); stress = force / area; each stud's
// share is its tributary arc, A/n (common practice; docs/REFERENCE.md §9a). Numbers worked by hand below.

describe('gasket contact area (area of an annulus)', () => {
  it('SI: Di 100 mm, Do 150 mm', () => {
    // π/4 (150² − 100²) = π/4 × 12,500 = 3125π = 9,817.477 mm² (by hand)
    expect(gasketContactArea({ innerMm: 100, outerMm: 150 })).toBeCloseTo(9817.477, 3);
  });

  it('US: Di 4.5 in, Do 5.5 in', () => {
    // π/4 (5.5² − 4.5²) = π/4 × (30.25 − 20.25) = 2.5π = 7.853982 in² (by hand)
    const areaMm2 = gasketContactArea({ innerMm: inToMm(4.5), outerMm: inToMm(5.5) });
    expect(areaMm2).toBeCloseTo(in2ToMm2(7.853982), 2);
  });

  it('takes an area as given, and refuses an outer diameter not above the inner', () => {
    expect(gasketContactArea({ areaMm2: 5000 })).toBe(5000);
    expect(() => gasketContactArea({ innerMm: 150, outerMm: 150 })).toThrow('The outer contact diameter must be larger than the inner.');
    expect(() => gasketContactArea({ areaMm2: 0 })).toThrow('The gasket contact area must be more than zero.');
  });
});

describe('gasketStress (stress = force / area)', () => {
  const areaSi = 3125 * Math.PI; // Di 100 mm, Do 150 mm, above
  const loadsSi = [90_000, 110_000, 100_000, 100_000, 100_000, 100_000, 100_000, 100_000];

  it('SI: 8 studs, 800 kN in all, on 9,817.477 mm²', () => {
    // 800,000 N / 9,817.477 mm² = 81.487 MPa (by hand)
    expect(gasketStress(loadsSi, areaSi)).toBeCloseTo(81.487, 3);
  });

  it('SI per position: each stud over its tributary arc, A/8 = 1,227.185 mm²', () => {
    // 90,000 / 1,227.185 = 73.339 MPa; 110,000 / 1,227.185 = 89.636 MPa; 100,000 / 1,227.185 = 81.487 MPa (by hand)
    const s = positionGasketStresses(loadsSi, areaSi);
    expect(s[0]).toBeCloseTo(73.339, 3);
    expect(s[1]).toBeCloseTo(89.636, 3);
    expect(s[2]).toBeCloseTo(81.487, 3);
  });

  it('US: 8 studs at 10,000 lbf on 7.853982 in²', () => {
    // 80,000 lbf / 7.853982 in² = 10,185.92 psi (by hand)
    const areaMm2 = in2ToMm2(2.5 * Math.PI);
    const loads = Array.from({ length: 8 }, () => lbfToN(10_000));
    expect(mpaToPsi(gasketStress(loads, areaMm2))).toBeCloseTo(10_185.92, 1);
    // One stud at 12,000 lbf over A/8 = 0.9817477 in²: 12,223.10 psi (by hand)
    loads[0] = lbfToN(12_000);
    expect(mpaToPsi(positionGasketStresses(loads, areaMm2)[0]!)).toBeCloseTo(12_223.10, 1);
  });

  it('refuses a missing load', () => {
    expect(() => gasketStress([1, Number.NaN], 100)).toThrow('Every stud needs a load');
    expect(() => gasketStress([], 100)).toThrow('Every stud needs a load');
  });
});

describe('studLoadForGasketStress (the inverse, F = σ·A/n)', () => {
  it('SI: 69 MPa on 9,817.477 mm² with 8 studs', () => {
    // 69 MPa is y for spiral-wound, non-asbestos filled, ASME VIII-1 App. 2 (docs/REFERENCE.md §7).
    // 69 × 9,817.477 / 8 = 84,675.74 N per stud (by hand)
    expect(studLoadForGasketStress(69, 3125 * Math.PI, 8)).toBeCloseTo(84_675.74, 1);
  });

  it('US: 10,000 psi on 7.853982 in² with 8 studs', () => {
    // 10,000 × 7.853982 / 8 = 9,817.48 lbf per stud (by hand)
    const n = studLoadForGasketStress(psiToMpa(10_000), in2ToMm2(2.5 * Math.PI), 8);
    expect(nToLbf(n)).toBeCloseTo(9_817.48, 1);
  });

  it('round-trips with gasketStress', () => {
    const area = 3125 * Math.PI;
    const perStud = studLoadForGasketStress(120, area, 12);
    expect(gasketStress(Array.from({ length: 12 }, () => perStud), area)).toBeCloseTo(120, 9);
  });

  it('refuses a zero stress or a fractional stud count', () => {
    expect(() => studLoadForGasketStress(0, 100, 8)).toThrow('The target gasket stress must be more than zero.');
    expect(() => studLoadForGasketStress(10, 100, 2.5)).toThrow('whole number');
  });
});

describe('against the seating and maximum stress', () => {
  it('names the positions outside the limits (SI loads above, limits 75 and 85 MPa)', () => {
    // Position 1 at 73.339 MPa < 75 (below seating); position 2 at 89.636 MPa > 85 (above the maximum); the rest 81.487.
    const summary = gasketStressSummary([90_000, 110_000, 100_000, 100_000], (3125 * Math.PI) / 2, { minSeatingMpa: 75, maxMpa: 85 });
    expect(summary.belowSeating).toEqual([1]);
    expect(summary.aboveMax).toEqual([2]);
    expect(summary.averageMpa).toBeCloseTo(81.487, 3);
  });

  it('says unknown without limits', () => {
    expect(gasketStressLevel(50, { minSeatingMpa: null, maxMpa: null })).toBe('unknown');
    expect(gasketStressLevel(50, { minSeatingMpa: 69, maxMpa: null })).toBe('below_seating');
    expect(gasketStressLevel(250, { minSeatingMpa: 69, maxMpa: 207 })).toBe('above_max');
    expect(gasketStressLevel(100, { minSeatingMpa: 69, maxMpa: 207 })).toBe('within');
  });
});
