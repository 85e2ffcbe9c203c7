import { describe, expect, it } from 'vitest';
import { computeCalculator, type CalculatorInputs } from '@/lib/calc/calculate';
import { estimateNutBearing } from '@/lib/calc/nut-bearing';
import { NUT_FACTOR_SUGGESTIONS } from '@/lib/calc/nut-factors';
import { inToMm, ksiToMpa, mmToIn, nToLbf, nmToFtLb, mm2ToIn2 } from '@/lib/calc/units';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

const base = (): CalculatorInputs => ({
  thread: { system: 'inch', diameterIn: 0.75, threadsPerInch: 10 },
  grade: 'A193-B7',
  target: { kind: 'percentOfYield', percent: 50 },
  nutFactor: 0.2,
  longForm: { muThread: 0.15, muBearing: 0.15, bearingOdMm: inToMm(1.25), holeDiameterMm: inToMm(0.875) },
  tensioner: { ltf: { kind: 'rule', rule: 'tens1', clampLengthMm: inToMm(3) }, pistonAreaMm2: null },
});

describe('computeCalculator', () => {
  it('reproduces the docs/REFERENCE.md §3 checks for 3/4-10 B7 at 50 % of yield', () => {
    const r = computeCalculator(base());
    expect(r.errors).toEqual({});
    // As by formula 0.3345 in² (docs/REFERENCE.md §1, computed); F = 0.5 × 105 ksi × 0.33446 in² = 17,559 lbf.
    expect(mm2ToIn2(r.thread!.tensileStressAreaMm2)).toBeCloseTo(0.3345, 4);
    expect(rel(nToLbf(r.preload!.forceN), 0.5 * 105_000 * 0.33446071)).toBeLessThan(1e-7);
    expect(r.preload!.percentOfYield).toBeCloseTo(50, 10);
    // With the table area 0.334 the check gives 219 ft-lb; with 0.3345 it is 219.5 ft-lb (by hand).
    expect(nmToFtLb(r.shortForm!.torqueNm)).toBeCloseTo(0.2 * 0.75 * 0.5 * 105_000 * 0.33446071 / 12, 3);
    // Long form with d2 = 0.75 − 0.6495/10 = 0.68505 in → K ≈ 0.21 (docs/REFERENCE.md §3).
    expect(Number(r.longForm!.equivalentNutFactor.toFixed(2))).toBe(0.21);
    expect(r.warnings).toEqual([]);
  });

  it('computes the tensioner load with TENS1 and the pressure for a piston area', () => {
    const inputs = base();
    inputs.tensioner = { ltf: { kind: 'rule', rule: 'tens1', clampLengthMm: inToMm(3) }, pistonAreaMm2: 2000 };
    const r = computeCalculator(inputs);
    // LTF = 1.01 + 0.75/3 = 1.26 [TENS1]
    expect(r.tensioner!.ltf).toBeCloseTo(1.26, 12);
    expect(r.tensioner!.appliedPercentOfYield).toBeCloseTo(63, 10);
    expect(r.tensioner!.pressureMpa).toBeCloseTo((r.preload!.forceN * 1.26) / 2000, 8);
  });

  it('takes a target stress instead of a % of yield', () => {
    const inputs = base();
    inputs.target = { kind: 'stress', stressMpa: ksiToMpa(52.5) };
    expect(computeCalculator(inputs).preload!.percentOfYield).toBeCloseTo(50, 10);
  });

  it('warns at a high target and when the tensioner load passes 95 % of yield [TENS1]', () => {
    const inputs = base();
    inputs.target = { kind: 'percentOfYield', percent: 80 };
    inputs.tensioner = { ltf: { kind: 'custom', value: 1.2 }, pistonAreaMm2: null };
    const r = computeCalculator(inputs);
    expect(r.warnings.map((w) => w.code)).toEqual(['above-usual-range', 'applied-above-95']);
  });

  it('cautions for a K outside the measured 0.086–0.52 [HBJ] and a pressure above 1500 bar', () => {
    const inputs = base();
    inputs.nutFactor = 0.06;
    inputs.tensioner = { ltf: { kind: 'custom', value: 1.1 }, pistonAreaMm2: 50 };
    const codes = computeCalculator(inputs).warnings.map((w) => w.code);
    expect(codes).toContain('k-outside-measured');
    expect(codes).toContain('pressure-high');
  });

  it('returns a sentence per bad field and still computes what it can', () => {
    const inputs = base();
    inputs.thread = { system: 'inch', diameterIn: 0.75, threadsPerInch: 50 };
    inputs.nutFactor = Number.NaN;
    const r = computeCalculator(inputs);
    expect(r.errors.threadsPerInch).toBe('Threads per inch must be between 4 and 40.');
    expect(r.errors.nutFactor).toBe('Enter the nut factor (K) as a number.');
    expect(r.thread).toBeUndefined();
    expect(r.preload).toBeUndefined();
  });

  it('reports a grade outside its table as an error on the grade field', () => {
    const inputs = base();
    inputs.grade = 'A193-B8-CL2';
    inputs.thread = { system: 'inch', diameterIn: 1, threadsPerInch: 8 };
    const r = computeCalculator(inputs);
    expect(r.errors.grade).toMatch(/only up to 0.75 in/);
    expect(r.thread).toBeDefined();
    expect(r.preload).toBeUndefined();
  });

  it('rejects a hole as large as the bearing diameter', () => {
    const inputs = base();
    inputs.longForm = { ...inputs.longForm, holeDiameterMm: inputs.longForm.bearingOdMm };
    expect(computeCalculator(inputs).errors.holeDiameter).toBe('The hole must be smaller than the nut bearing diameter.');
  });
});

describe('starting values', () => {
  it('estimates the 3/4 in heavy-hex bearing as 1.25 in across flats and a 0.875 in hole (docs/REFERENCE.md §3, §6)', () => {
    const b = estimateNutBearing(inToMm(0.75));
    expect(mmToIn(b.bearingOdMm)).toBeCloseTo(1.25, 12);
    expect(mmToIn(b.holeDiameterMm)).toBeCloseTo(0.875, 12);
  });

  it('names a source for every nut factor suggestion', () => {
    for (const s of NUT_FACTOR_SUGGESTIONS) expect(s.source.length).toBeGreaterThan(3);
    expect(NUT_FACTOR_SUGGESTIONS.find((s) => s.id === 'anti-seize')?.k).toBe(0.12); // [SHIG]
  });
});
