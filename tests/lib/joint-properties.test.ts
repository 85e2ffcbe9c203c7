import { describe, expect, it } from 'vitest';
import { GRADES } from '@/lib/calc/grades';
import { gradeIdOf, gradeStoredName, maxBelievableStudLoad, studDiameterM, tensileStressAreaM2Of, threadSpecOf } from '@/lib/joints/joint-properties';

const rel = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

describe('threadSpecOf and studDiameterM (stored thread columns)', () => {
  it('reads inch columns as inches and threads per inch, metric columns as mm and pitch', () => {
    expect(threadSpecOf({ threadSystem: 'inch', threadDiameter: 0.625, threadPitch: 11 })).toEqual({ system: 'inch', diameterIn: 0.625, threadsPerInch: 11 });
    expect(threadSpecOf({ threadSystem: 'metric', threadDiameter: 20, threadPitch: 2.5 })).toEqual({ system: 'metric', diameterMm: 20, pitchMm: 2.5 });
  });

  it('gives D in metres through the exact inch (1 in = 25.4 mm: international yard and pound, 1959)', () => {
    // 5/8 in = 15.875 mm exactly; 3/4 in = 19.05 mm exactly; M20 = 20 mm.
    expect(rel(studDiameterM({ threadSystem: 'inch', threadDiameter: 0.625 }), 0.015875)).toBeLessThan(1e-15);
    expect(rel(studDiameterM({ threadSystem: 'inch', threadDiameter: 0.75 }), 0.01905)).toBeLessThan(1e-15);
    expect(studDiameterM({ threadSystem: 'metric', threadDiameter: 20 })).toBe(0.02);
  });

  it('gives the tensile stress area of 3/4-10 UNC in m², and null for an impossible thread', () => {
    // ASME B1.1 table: As = 0.334 in² for 3/4-10 UNC (docs/REFERENCE.md §1 ✓ [EE-AREA]); 1 in² = 645.16 mm² exactly.
    expect(rel(tensileStressAreaM2Of({ threadSystem: 'inch', threadDiameter: 0.75, threadPitch: 10 })!, 0.334 * 645.16e-6)).toBeLessThan(0.002);
    expect(tensileStressAreaM2Of({ threadSystem: 'inch', threadDiameter: 0.05, threadPitch: 10 })).toBeNull();
  });
});

describe('gradeIdOf (the one reader of the stored grade text)', () => {
  it.each([
    ['ASTM A193 B7', 'A193-B7'],
    ['A193-B7', 'A193-B7'],
    ['A193-B16', 'A193-B16'],
    ['ASTM A193M B7', 'A193M-B7'],
    ['ASTM A193 B7M', 'A193-B7M'],
    ['A193 B8 Class 2', 'A193-B8-CL2'],
    ['ASTM A193 B8 CL 2', 'A193-B8-CL2'],
    ['ASTM A193 B8M Class 1', 'A193-B8-CL1'],
    ['ASTM A193 B8', 'A193-B8-CL1'],
    ['something else', null],
    ['Unobtainium', null],
    ['ASTM A194 2H', null],
  ])('reads %s as %s', (text, id) => {
    expect(gradeIdOf(text)).toBe(id);
  });

  it('reads back every stored name the joint form writes, the B8 classes included', () => {
    expect(gradeStoredName('A193-B7')).toBe('ASTM A193 B7');
    for (const { id } of GRADES) expect(gradeIdOf(gradeStoredName(id))).toBe(id);
  });

  it("reads the calculator's own grade labels", () => {
    for (const { id, label } of GRADES) expect(gradeIdOf(label)).toBe(id);
  });
});

describe('maxBelievableStudLoad', () => {
  it('is 1.2 × the minimum tensile load for a B7 5/8-11 stud', () => {
    // B7 ≤ 2-1/2 in: minimum tensile 125 ksi (ASTM A193, Table 2; docs/REFERENCE.md §2 ✓ [NANL]);
    // As = 0.226 in² (ASME B1.1 table, docs/REFERENCE.md §1 ✓ [EE-AREA]); 1 ksi·in² = 4448.2216152605 N (exact).
    const expected = 1.2 * 125 * 0.226 * 4448.2216152605;
    const limit = maxBelievableStudLoad({ threadSystem: 'inch', threadDiameter: 0.625, threadPitch: 11, studGrade: 'ASTM A193 B7', targetLoadN: 50_000 });
    expect(rel(limit.maxStudLoadN, expected)).toBeLessThan(0.002);
    expect(limit.source).toMatch(/^1\.2 × the stud's minimum tensile load of/);
  });

  it('falls back to 3 × the target load for a grade outside the table', () => {
    const limit = maxBelievableStudLoad({ threadSystem: 'metric', threadDiameter: 20, threadPitch: 2.5, studGrade: 'Grade 8.8', targetLoadN: 100_000 });
    expect(limit.maxStudLoadN).toBe(300_000);
    expect(limit.source).toContain('"Grade 8.8" is not in our table');
  });
});
