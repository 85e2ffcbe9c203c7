import { describe, expect, it } from 'vitest';
import { GRADE_TABLE, gradeProperties, gradePropertiesForThread } from '@/lib/calc/grades';
import { inToMm, ksiToMpa } from '@/lib/calc/units';

const b7 = (inches: number) => gradeProperties('A193-B7', inToMm(inches));

describe('ASTM A193 B7 minimum strength by diameter ([NANL], [BACO] via docs/REFERENCE.md §2)', () => {
  it('≤ 2-1/2 in: 125 ksi tensile, 105 ksi yield', () => {
    expect(b7(0.75).native).toEqual({ tensile: 125, yield: 105, unit: 'ksi' });
    expect(b7(2.5).native).toEqual({ tensile: 125, yield: 105, unit: 'ksi' }); // boundary, inclusive
    expect(gradeProperties('A193-B7', 63.5).native.yield).toBe(105); // 63.5 mm = 2.5 in exactly
  });

  it('> 2-1/2 to 4 in: 115/95 ksi', () => {
    expect(b7(2.5001).native).toEqual({ tensile: 115, yield: 95, unit: 'ksi' });
    expect(b7(4).native).toEqual({ tensile: 115, yield: 95, unit: 'ksi' });
  });

  it('> 4 to 7 in: 100/75 ksi', () => {
    expect(b7(4.0001).native).toEqual({ tensile: 100, yield: 75, unit: 'ksi' });
    expect(b7(7).native).toEqual({ tensile: 100, yield: 75, unit: 'ksi' });
  });

  it('converts to MPa with the exact factor (docs/REFERENCE.md §2: 862/724 MPa, computed)', () => {
    const p = b7(1);
    expect(p.tensileMpa).toBe(ksiToMpa(125));
    expect(Math.round(p.tensileMpa)).toBe(862);
    expect(Math.round(p.yieldMpa)).toBe(724);
  });

  it('errors clearly above 7 in', () => {
    expect(() => b7(7.5)).toThrow('ASTM A193 B7 (Cr-Mo, quenched and tempered) values are tabulated only up to 7 in; this stud is 7.5 in.');
  });
});

describe('other grades (docs/REFERENCE.md §2)', () => {
  // Over M64 795/655 MPa is from memory, unverified (docs/REFERENCE.md §2); the screen names the table to check.
  it('A193M B7 ≤ M64: 860/720 MPa [A193M]; over M64 795/655 MPa (from memory), both sent to ASTM A193M Table 2', () => {
    const m = gradeProperties('A193M-B7', 64);
    expect([m.tensileMpa, m.yieldMpa]).toEqual([860, 720]);
    const big = gradeProperties('A193M-B7', 72);
    expect([big.tensileMpa, big.yieldMpa]).toEqual([795, 655]);
    expect(big.source).toBe('ASTM A193M, Table 2');
  });

  it('B7M 100/80 ksi [NANL], B16 125/105 ksi [NANL], B8 Class 1 75/30 ksi [BACO]', () => {
    expect(gradeProperties('A193-B7M', inToMm(1)).native).toMatchObject({ tensile: 100, yield: 80 });
    expect(gradeProperties('A193-B16', inToMm(1)).native).toMatchObject({ tensile: 125, yield: 105 });
    expect(gradeProperties('A193-B8-CL1', inToMm(1)).native).toMatchObject({ tensile: 75, yield: 30 });
  });

  it('B8 Class 2 125/100 ksi up to 3/4 in [BACO], and an error above', () => {
    expect(gradeProperties('A193-B8-CL2', inToMm(0.75)).native).toMatchObject({ tensile: 125, yield: 100 });
    expect(() => gradeProperties('A193-B8-CL2', inToMm(1))).toThrow(/only up to 0.75 in; this stud is 1 in/);
  });

  it('B16 is tabulated only to 2-1/2 in', () => {
    expect(() => gradeProperties('A193-B16', inToMm(3))).toThrow(/only up to 2.5 in/);
  });

  it('looks up by thread spec', () => {
    expect(gradePropertiesForThread('A193-B7', { system: 'metric', diameterMm: 24, pitchMm: 3 }).native.yield).toBe(105);
  });

  it('rejects a non-positive diameter and names a standard and table on every row', () => {
    expect(() => gradeProperties('A193-B7', 0)).toThrow(/positive/);
    for (const row of GRADE_TABLE) expect(row.source).toMatch(/^ASTM A193M?, Table 2$/);
  });
});
