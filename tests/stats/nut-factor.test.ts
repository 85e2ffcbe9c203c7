import { describe, expect, it } from 'vitest';
import { nutFactor } from '@/lib/stats';
import { relativeError } from './support/lre';

// Worked check: docs/REFERENCE.md §3 — 3/4-10 B7 stud at 50 % of yield, F = 0.5 × 105 ksi × 0.334 in² = 17,535 lbf;
// with K = 0.20 the short-form relation (common practice) T = K·D·F/12 gives
// T = 0.20 × 0.75 × 17,535 / 12 = 219.1875 ft-lb (≈ 219.2 ft-lb; docs/REFERENCE.md §3 rounds to 219).
const T_FTLB = (0.2 * 0.75 * 17_535) / 12;
// Unit conversions (exact by definition): 1 in = 0.0254 m; 1 lbf = 4.4482216152605 N;
// 1 ft-lb = 0.3048 m × 4.4482216152605 N = 1.3558179483314004 N·m.
const IN = 0.0254;
const LBF = 4.4482216152605;
const FTLB = 0.3048 * LBF;

describe('nutFactor', () => {
  it('nutFactor recovers K = 0.20 from the 3/4 in, 17,535 lbf, 219.19 ft-lb worked check in US units (short-form relation, common practice)', () => {
    expect(Math.abs(T_FTLB - 219.2)).toBeLessThan(0.05); // docs/REFERENCE.md §3 worked check, rounded
    const r = nutFactor({ torque: [T_FTLB, 2 * T_FTLB], diameter: [0.75, 0.75], force: [17_535, 35_070] }, { units: 'US' });
    expect(relativeError(r.perReading[0]!, 0.2)).toBeLessThan(1e-14);
    expect(relativeError(r.fitted, 0.2)).toBeLessThan(1e-14);
    expect(r.standardError).toBeLessThan(1e-14); // exact data: zero residual
  });

  it('nutFactor gives the same K in SI units (N·m, m, N) for the same joint', () => {
    const r = nutFactor(
      { torque: [T_FTLB * FTLB, 2 * T_FTLB * FTLB], diameter: [0.75 * IN, 0.75 * IN], force: [17_535 * LBF, 35_070 * LBF] },
      { units: 'SI' },
    );
    expect(relativeError(r.fitted, 0.2)).toBeLessThan(1e-13);
    // Hand: T ≈ 219.1875 ft-lb × 1.35582 = 297.18 N·m, D = 0.01905 m, F ≈ 78 000 N.
    expect(Math.abs(T_FTLB * FTLB - 297.18)).toBeLessThan(0.01);
  });

  it('nutFactor with scattered readings: fitted K = ΣxT/Σx², SE and t interval by hand', () => {
    // SI readings, D = 0.02 m: x = D·F = 1000, 2000, 3000 N·m per unit K; T = 180, 420, 570 N·m.
    // Hand: Σx² = 14e6, ΣxT = 180e3 + 840e3 + 1710e3 = 2.73e6 -> K = 0.195.
    // Residuals 180 − 195 = −15, 420 − 390 = 30, 570 − 585 = −15; SSR = 1350; s² = 675;
    // SE = √(675/14e6) = 0.0069437…; t(0.975, 2) = 4.302652729749464 (scipy.stats.t.ppf).
    const r = nutFactor({ torque: [180, 420, 570], diameter: [0.02, 0.02, 0.02], force: [50_000, 100_000, 150_000] }, { units: 'SI' });
    expect(relativeError(r.fitted, 0.195)).toBeLessThan(1e-14);
    const se = Math.sqrt(675 / 14e6);
    expect(relativeError(r.standardError, se)).toBeLessThan(1e-12);
    expect(relativeError(r.confidenceInterval.upper, 0.195 + 4.302652729749464 * se)).toBeLessThan(1e-12);
    expect(r.perReading.map((k) => Number(k.toFixed(12)))).toEqual([0.18, 0.21, 0.19]);
    expect(r.dfResidual).toBe(2);
  });

  it('nutFactor rejects non-positive readings, mismatched lengths and a single reading', () => {
    expect(() => nutFactor({ torque: [1, 2], diameter: [1, 0], force: [1, 1] }, { units: 'SI' })).toThrow(
      'nutFactor requires positive torque, diameter and force (got 0 at reading 2)',
    );
    expect(() => nutFactor({ torque: [1, 2], diameter: [1, 1, 1], force: [1, 1] }, { units: 'SI' })).toThrow(
      'nutFactor requires as many diameters and forces as torques (got 2, 3, 2)',
    );
    expect(() => nutFactor({ torque: [1], diameter: [1], force: [1] }, { units: 'US' })).toThrow(
      'nutFactor requires at least two values of torque (got 1)',
    );
  });
});
