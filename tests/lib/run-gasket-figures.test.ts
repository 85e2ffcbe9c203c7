import { describe, expect, it } from 'vitest';
import { recordedGasket, storedGasketFigures } from '@/lib/record/run-gasket-figures';
import { groupGasketFigures } from '@/lib/analysis/group-gasket';
import { gasketStressByPass } from '@/lib/classroom/gasket-passes';
import { NO_GASKET_DATA, type JointGasket } from '@/lib/joints/gasket-input';

// Hand-worked values. Area of a ring: π/4 (Do² − Di²) (geometry); average gasket stress = total stud
// load ÷ contact area (stress = force / area; common practice for a ring gasket inside the bolt circle).
const ring = (innerMm: number, outerMm: number, minSeatingMpa: number | null = null): JointGasket => ({ ...NO_GASKET_DATA, innerMm, outerMm, minSeatingMpa });

describe('storedGasketFigures (the per-run gasket stress stored on runs)', () => {
  it('SI: 8 studs at 50 kN on a 100/150 mm ring give 128/π ≈ 40.744 MPa', () => {
    // A = π/4 (150² − 100²) = 3125π mm²; F = 8 × 50,000 = 400,000 N; σ = 400,000 / 3125π = 128/π MPa (hand-worked).
    const f = storedGasketFigures(Array(8).fill(50_000), ring(100, 150, 69));
    expect(f.finalGasketStressMpa).toBeCloseTo(128 / Math.PI, 9);
    expect(f.finalGasketStressMpa).toBeCloseTo(40.744, 3);
    expect(f.gasketMinSeatingMpa).toBe(69);
  });

  it('US: 8 studs at 10,000 lbf on a 4/6 in ring give 16,000/π ≈ 5,093 psi', () => {
    // A = π/4 (6² − 4²) = 5π in²; F = 8 × 10,000 = 80,000 lbf; σ = 80,000 / 5π = 16,000/π psi (hand-worked).
    // Stored in SI: 1 in = 25.4 mm, 1 lbf = 4.4482216152605 N, 1 psi = 6,894.757293168 Pa (exact definitions, NIST SP 811 App. B).
    const f = storedGasketFigures(Array(8).fill(10_000 * 4.4482216152605), ring(4 * 25.4, 6 * 25.4));
    const psi = (f.finalGasketStressMpa! * 1e6) / 6894.757293168;
    expect(psi).toBeCloseTo(16_000 / Math.PI, 6);
    expect(psi).toBeCloseTo(5092.96, 2);
    expect(f.gasketMinSeatingMpa).toBeNull();
  });

  it('takes a contact area given directly, and is null without one or without final loads', () => {
    // 4 × 25,000 N over 10,000 mm² = 10 MPa (hand-worked).
    expect(storedGasketFigures([25_000, 25_000, 25_000, 25_000], { ...NO_GASKET_DATA, areaMm2: 10_000 }).finalGasketStressMpa).toBeCloseTo(10, 12);
    expect(storedGasketFigures([25_000, 25_000], NO_GASKET_DATA)).toEqual({ finalGasketStressMpa: null, gasketMinSeatingMpa: null });
    expect(storedGasketFigures(null, ring(100, 150, 69))).toEqual({ finalGasketStressMpa: null, gasketMinSeatingMpa: null });
    expect(storedGasketFigures([], ring(100, 150, 69)).finalGasketStressMpa).toBeNull();
  });

  it('uses the gasket as recorded, and the joint’s current data only for versions without a gasket snapshot', () => {
    const recorded = ring(100, 150, 69);
    const current = ring(120, 150, 50);
    expect(recordedGasket(recorded, current)).toBe(recorded);
    expect(recordedGasket(undefined, current)).toBe(current);
    expect(recordedGasket(null, current)).toBe(current);
  });
});

describe('groupGasketFigures (compare)', () => {
  it('means the runs with gasket data and counts the share reaching the seating stress among runs that have one', () => {
    // Runs at 40 and 60 MPa (seating 50) and 30 MPa (no seating set), one without gasket data:
    // mean (40 + 60 + 30) / 3 = 43.33 MPa; seated 1 of 2 = 0.5 (hand-worked).
    const g = groupGasketFigures([{ gasket: { stressMpa: 40, minSeatingMpa: 50 } }, { gasket: { stressMpa: 60, minSeatingMpa: 50 } }, { gasket: { stressMpa: 30, minSeatingMpa: null } }, { gasket: null }]);
    expect(g.meanStressMpa).toBeCloseTo(130 / 3, 12);
    expect(g).toMatchObject({ runsWithGasket: 3, seatedShare: 0.5, runsWithSeating: 2 });
  });

  it('counts a run exactly at the seating stress as seated, and has no figures without gasket data', () => {
    expect(groupGasketFigures([{ gasket: { stressMpa: 50, minSeatingMpa: 50 } }]).seatedShare).toBe(1);
    expect(groupGasketFigures([{ gasket: null }, {}])).toEqual({ meanStressMpa: null, runsWithGasket: 0, seatedShare: null, runsWithSeating: 0 });
  });
});

describe('gasketStressByPass (classroom)', () => {
  it('gives the average after each pass against seating and maximum', () => {
    // 10,000 mm² contact; pass 1: 4 × 15,000 N = 6 MPa (below seating 10); pass 2: 4 × 30,000 N = 12 MPa (within 10–20) (hand-worked).
    const pass = (n: number, load: number) => ({ pass: n, percentOfTarget: null, loadsAfterN: Array(4).fill(load), meanLossPercent: 0, cv: 0 });
    const rows = gasketStressByPass([pass(1, 15_000), pass(2, 30_000)], { areaMm2: 10_000, minSeatingMpa: 10, maxMpa: 20, source: null });
    expect(rows.map((r) => [r.pass, Number(r.averageMpa.toFixed(9)), r.level])).toEqual([[1, 6, 'below_seating'], [2, 12, 'within']]);
  });
});
