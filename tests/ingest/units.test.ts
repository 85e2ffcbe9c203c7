import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/http/errors';
import { LOAD_UNITS, loadToN, microstrainToN, nToLoad, nmToTorque, NEWTONS_PER_KIP, NEWTONS_PER_LBF, NM_PER_FT_LB, torqueToNm } from '@/lib/ingest/units';

const strain = { youngsModulusPa: 200e9, stressAreaM2: 245e-6, calibrationFactor: 1.03 };

describe('units', () => {
  it('uses the exact pound-force and foot-pound factors', () => {
    // 0.45359237 kg × 9.80665 m/s² and 0.3048 m × that (definitions, from memory; products computed).
    expect(NEWTONS_PER_LBF).toBeCloseTo(0.45359237 * 9.80665, 12);
    expect(NM_PER_FT_LB).toBeCloseTo(0.3048 * 0.45359237 * 9.80665, 12);
    expect(NEWTONS_PER_KIP).toBe(1000 * NEWTONS_PER_LBF);
  });

  it('converts known values: 1 kN, 10 kip, 100 ft-lb', () => {
    expect(loadToN(1, 'kN')).toBe(1000);
    expect(loadToN(10, 'kip')).toBeCloseTo(44_482.216152605, 6);
    expect(torqueToNm(100, 'ft-lb')).toBeCloseTo(135.58179483314004, 10);
    expect(torqueToNm(42, 'N·m')).toBe(42);
  });

  it('microstrain: 1000 µε at 200 GPa on 245 mm² is 49 kN (docs/REFERENCE.md §2: 200 MPa), times the calibration', () => {
    expect(microstrainToN(1000, { youngsModulusPa: 200e9, stressAreaM2: 245e-6 })).toBeCloseTo(49_000, 6);
    expect(loadToN(1000, 'microstrain', strain)).toBeCloseTo(49_000 * 1.03, 6);
  });

  it.each(LOAD_UNITS)('round-trips %s -> N -> %s within 1e-12 relative', (unit) => {
    for (const v of [0, 0.001, 1, 123.456, 98_765.4321]) {
      const back = nToLoad(loadToN(v, unit, strain), unit, strain);
      expect(Math.abs(back - v)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(v)));
    }
  });

  it('round-trips torque in both units', () => {
    for (const v of [0, 1, 250.75, 1e4]) {
      expect(torqueToNm(nmToTorque(v, 'ft-lb'), 'ft-lb')).toBeCloseTo(v, 9);
      expect(nmToTorque(torqueToNm(v, 'N·m'), 'N·m')).toBe(v);
    }
  });

  it('rejects microstrain without a modulus or with a zero area', () => {
    expect(() => loadToN(1, 'microstrain')).toThrow(AppError);
    expect(() => microstrainToN(1, { youngsModulusPa: 200e9, stressAreaM2: 0 })).toThrow(/Stress area must be a positive/);
  });
});
