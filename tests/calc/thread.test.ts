import { describe, expect, it } from 'vitest';
import { isAppError } from '@/lib/http/errors';
import {
  inchRootAreaIn2,
  inchTensileStressAreaIn2,
  metricTensileStressAreaMm2,
  standardThread,
  STANDARD_THREADS,
  threadGeometry,
  threadLabel,
  threadSpecSchema,
} from '@/lib/calc/thread';
import { mm2ToIn2 } from '@/lib/calc/units';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/*
 * Tolerance: the handbook tables print 3 or 4 significant figures, so rounding alone allows up to
 * ±0.005/0.226 ≈ 0.22 % (5/8-11) and ±0.5/157 ≈ 0.32 % (M16). The largest gap between the formula
 * and a table value is 1-5/8-8 UN (1.7747 against 1.78 in², 0.30 %), slightly more than rounding
 * explains, so we allow 0.5 % relative and no more.
 */
const TABLE_TOL = 0.005;

// [EE-AREA] via docs/REFERENCE.md §1: unified inch tensile stress areas, in².
const INCH_TABLE: [string, number, number, number][] = [
  ['1/2-13', 0.5, 13, 0.1419],
  ['5/8-11', 0.625, 11, 0.226],
  ['3/4-10', 0.75, 10, 0.334],
  ['7/8-9', 0.875, 9, 0.462],
  ['1-8', 1, 8, 0.606],
  ['1-1/8-8', 1.125, 8, 0.79],
  ['1-1/4-8', 1.25, 8, 1.0],
  ['1-3/8-8', 1.375, 8, 1.233],
  ['1-1/2-8', 1.5, 8, 1.492],
  ['1-5/8-8', 1.625, 8, 1.78],
  ['1-3/4-8', 1.75, 8, 2.08],
  ['2-8', 2, 8, 2.77],
];

// [ISO898] via docs/REFERENCE.md §1: ISO 898-1 tensile stress areas, mm².
const METRIC_TABLE: [string, number, number, number][] = [
  ['M12', 12, 1.75, 84.3],
  ['M16', 16, 2, 157],
  ['M20', 20, 2.5, 245],
  ['M24', 24, 3, 353],
  ['M27', 27, 3, 459],
  ['M30', 30, 3.5, 561],
  ['M33', 33, 3.5, 694],
  ['M36', 36, 4, 817],
];

describe('inch tensile stress area (ASME B1.1 formula [EE-B1.1])', () => {
  it.each(INCH_TABLE)('%s matches the handbook table [EE-AREA] within 0.5 %%', (_id, D, n, table) => {
    expect(rel(inchTensileStressAreaIn2(D, n), table)).toBeLessThan(TABLE_TOL);
  });

  it.each(INCH_TABLE)('%s: threadGeometry gives the same area in mm² as the inch formula', (id, _D, _n, table) => {
    const geo = threadGeometry(standardThread(id).spec);
    expect(rel(mm2ToIn2(geo.tensileStressAreaMm2), table)).toBeLessThan(TABLE_TOL);
  });
});

describe('metric tensile stress area (ISO 898-1 formula [TRIB])', () => {
  it.each(METRIC_TABLE)('%s matches the ISO 898-1 table [ISO898] within 0.5 %%', (id, d, P, table) => {
    expect(rel(metricTensileStressAreaMm2(d, P), table)).toBeLessThan(TABLE_TOL);
    expect(rel(threadGeometry(standardThread(id).spec).tensileStressAreaMm2, table)).toBeLessThan(TABLE_TOL);
  });

  it('agrees with the equivalent form 0.7854 (d − 0.9382P)² [EE-ISO] to 1e-4 relative', () => {
    for (const [, d, P] of METRIC_TABLE) {
      expect(rel(metricTensileStressAreaMm2(d, P), 0.7854 * (d - 0.9382 * P) ** 2)).toBeLessThan(1e-4);
    }
  });

  it('gives d2 and d3 for M20 as docs/REFERENCE.md §1 computes them (18.376 and 16.933 mm)', () => {
    const geo = threadGeometry({ system: 'metric', diameterMm: 20, pitchMm: 2.5 });
    expect(geo.pitchDiameterMm).toBeCloseTo(18.376, 3);
    expect(geo.minorDiameterMm).toBeCloseTo(16.933, 3);
  });
});

describe('inch root area 0.7854 (D − 1.2990/n)²', () => {
  // Root areas: [TME] for the first three, [FAST] for 1-8 (docs/REFERENCE.md §1). Printed to 3–4 figures:
  // 0.5 % covers the rounding (±0.0005/0.202 ≈ 0.25 %).
  it.each([
    [0.5, 13, 0.1257],
    [0.625, 11, 0.202],
    [0.75, 10, 0.302],
    [1, 8, 0.551],
  ])('D = %s in, n = %s matches the root-area table value %s in²', (D, n, table) => {
    expect(rel(inchRootAreaIn2(D, n), table)).toBeLessThan(TABLE_TOL);
  });
});

describe('thread spec schema and lookups', () => {
  it('says in a sentence what is wrong with threads per inch', () => {
    const r = threadSpecSchema.safeParse({ system: 'inch', diameterIn: 0.75, threadsPerInch: 50 });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toBe('Threads per inch must be between 4 and 40.');
  });

  it('rejects a missing (NaN) pitch with a sentence', () => {
    const r = threadSpecSchema.safeParse({ system: 'metric', diameterMm: 20, pitchMm: Number.NaN });
    expect(r.error?.issues[0]?.message).toBe('Enter the pitch in millimetres as a number.');
  });

  it('threadGeometry throws an invalid_input AppError naming the field', () => {
    try {
      threadGeometry({ system: 'metric', diameterMm: 2, pitchMm: 0.4 });
      expect.unreachable();
    } catch (e) {
      expect(isAppError(e) && e.code).toBe('invalid_input');
      expect(isAppError(e) && e.details.field).toBe('diameterMm');
    }
  });

  it('lists 1/2-13 … 2-8 UN and M12 … M48, every one valid', () => {
    expect(STANDARD_THREADS.map((t) => t.id)).toEqual([
      '1/2-13', '5/8-11', '3/4-10', '7/8-9', '1-8', '1-1/8-8', '1-1/4-8', '1-3/8-8', '1-1/2-8', '1-5/8-8', '1-3/4-8', '2-8',
      'M12', 'M16', 'M20', 'M24', 'M27', 'M30', 'M33', 'M36', 'M42', 'M48',
    ]);
    for (const t of STANDARD_THREADS) expect(threadSpecSchema.safeParse(t.spec).success).toBe(true);
  });

  // The M42 and M48 coarse pitches are from memory, unverified (docs/REFERENCE.md §1): the screen
  // names the standard to check them against, and no trust note.
  it('names ISO 261 as the source of the M42 and M48 pitches', () => {
    expect(standardThread('M42').source).toBe('ISO 261 coarse pitch');
    expect(standardThread('M48').source).toBe('ISO 261 coarse pitch');
  });

  it('M42 × 4.5 gives the area docs/REFERENCE.md §1 computes (1120.9 mm²)', () => {
    expect(threadGeometry(standardThread('M42').spec).tensileStressAreaMm2).toBeCloseTo(1120.9, 1);
  });

  it('throws for an unknown standard thread and labels custom ones', () => {
    expect(() => standardThread('9/16-12')).toThrow(/no standard thread/);
    expect(threadLabel({ system: 'inch', diameterIn: 0.75, threadsPerInch: 10 })).toBe('3/4-10 UNC');
    expect(threadLabel({ system: 'metric', diameterMm: 22, pitchMm: 2.5 })).toBe('M22 × 2.5');
  });
});
