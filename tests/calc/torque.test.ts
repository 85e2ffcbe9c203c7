import { describe, expect, it } from 'vitest';
import {
  equivalentNutFactor,
  longFormArm,
  longFormTorqueNm,
  meanBearingDiameter,
  preloadFromLongFormTorque,
  preloadFromShortFormTorque,
  shortFormTorqueFtLb,
  shortFormTorqueNm,
} from '@/lib/calc/torque';
import { preloadFromPercentOfYield } from '@/lib/calc/preload';
import { threadGeometry } from '@/lib/calc/thread';
import { inToMm, ksiToMpa, lbfToN, nmToFtLb, in2ToMm2 } from '@/lib/calc/units';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('short form T = K·D·F ([SPR], docs/REFERENCE.md §3)', () => {
  it('US worked check: 3/4-10 B7 at 50 % of yield, K = 0.20 → ≈219 ft-lb (docs/REFERENCE.md §3)', () => {
    // F = 0.5 × 105 ksi × 0.334 in² = 17,535 lbf (docs/REFERENCE.md §3, table area [EE-AREA]).
    const F = 0.5 * 105_000 * 0.334;
    expect(F).toBeCloseTo(17_535, 6);
    // T = 0.20 × 0.75 in × 17,535 lbf / 12 = 219.19 ft-lb.
    const T = shortFormTorqueFtLb(0.2, 0.75, F);
    expect(T).toBeCloseTo(219.1875, 9);
    expect(Math.round(T)).toBe(219);
  });

  it('US worked check done in SI units gives the same ft-lb', () => {
    const F = preloadFromPercentOfYield(50, ksiToMpa(105), in2ToMm2(0.334));
    expect(rel(F, lbfToN(17_535))).toBeLessThan(1e-12);
    expect(rel(nmToFtLb(shortFormTorqueNm(0.2, inToMm(0.75), F)), 219.1875)).toBeLessThan(1e-12);
  });

  it('SI worked example: M20 × 2.5 A193M B7 (720 MPa yield [A193M]) at 50 % of yield, K = 0.20', () => {
    // By hand: d2 = 20 − 0.649519×2.5 = 18.3762 mm; d3 = 20 − 1.226869×2.5 = 16.9328 mm;
    // mean 17.6545 mm; As = π/4 × 17.6545² = 244.79 mm² (ISO 898-1 table 245 mm² [ISO898]).
    // σ = 0.5 × 720 = 360 MPa; F = 360 × 244.79 = 88,126 N.
    // T = 0.20 × 0.020 m × 88,126 N = 352.5 N·m.
    const geo = threadGeometry({ system: 'metric', diameterMm: 20, pitchMm: 2.5 });
    const F = preloadFromPercentOfYield(50, 720, geo.tensileStressAreaMm2);
    expect(rel(F, 88_126)).toBeLessThan(1e-4);
    expect(rel(shortFormTorqueNm(0.2, 20, F), 352.50)).toBeLessThan(1e-4);
  });

  it('inverts: F from T', () => {
    expect(rel(preloadFromShortFormTorque(352.50392, 0.2, 20), 88_125.98)).toBeLessThan(1e-6);
  });

  it('rejects a zero nut factor', () => {
    expect(() => shortFormTorqueNm(0, 20, 1000)).toThrow('Nut factor (K) must be a positive number.');
  });
});

describe('long form (VDI 2230 R13/1 [VDI-CODE], docs/REFERENCE.md §3)', () => {
  // docs/REFERENCE.md §3 worked check: 3/4-10, µ = 0.15 both, P 0.1 in, d2 0.685 in, heavy hex 1.25 in
  // across flats, 0.875 in hole → K ≈ 0.21, pitch term ≈ 10 % of torque.
  const D = 0.75;
  const Db = meanBearingDiameter(1.25, 0.875); // (1.25 + 0.875)/2 = 1.0625 in [TRIB2]
  const inputs = { pitchMm: 0.1, pitchDiameterMm: 0.685, muThread: 0.15, muBearing: 0.15, bearingDiameterMm: Db };

  it('reduces to K ≈ 0.21 for the stated friction values (docs/REFERENCE.md §3)', () => {
    expect(Db).toBe(1.0625);
    // By hand: [0.1/2π + 0.15×0.685/(2 cos 30°) + 0.15×1.0625/2]/0.75
    //        = [0.015915 + 0.059323 + 0.079688]/0.75 = 0.20657.
    const K = equivalentNutFactor(D, inputs);
    expect(K).toBeCloseTo(0.2066, 4);
    expect(Number(K.toFixed(2))).toBe(0.21);
  });

  it('puts about 10 % of the torque into the pitch term (docs/REFERENCE.md §3)', () => {
    const arm = longFormArm(inputs);
    expect(arm.pitchMm / arm.totalMm).toBeCloseTo(0.103, 3);
  });

  it('uses the constants 1/(2π) = 0.159 and 1/(2 cos 30°) = 0.577 (docs/REFERENCE.md §3) — VDI 2230 rounds them to 0.16 and 0.58', () => {
    const arm = longFormArm({ pitchMm: 1, pitchDiameterMm: 1, muThread: 1, muBearing: 0, bearingDiameterMm: 1 });
    expect(arm.pitchMm).toBeCloseTo(0.159, 3);
    expect(arm.threadMm).toBeCloseTo(0.577, 3);
  });

  it('long-form torque equals the short form with the equivalent K, and inverts', () => {
    const F = 80_000;
    const mm = {
      pitchMm: 2.54,
      pitchDiameterMm: inToMm(0.685),
      muThread: 0.12,
      muBearing: 0.12,
      bearingDiameterMm: inToMm(1.0625),
    };
    const T = longFormTorqueNm(F, mm);
    expect(rel(T, shortFormTorqueNm(equivalentNutFactor(inToMm(D), mm), inToMm(D), F))).toBeLessThan(1e-12);
    expect(rel(preloadFromLongFormTorque(T, mm), F)).toBeLessThan(1e-12);
  });

  it('refuses a hole as large as the bearing face', () => {
    expect(() => meanBearingDiameter(20, 20)).toThrow('The hole must be smaller than the nut bearing face.');
  });
});
