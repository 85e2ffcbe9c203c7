import { describe, expect, it } from 'vitest';
import {
  percentOfYield,
  preloadFromPercentOfYield,
  preloadFromStress,
  preloadWarnings,
  stressFromPreload,
} from '@/lib/calc/preload';

const codes = (r: number, a?: number) => preloadWarnings({ residualPercentOfYield: r, appliedPercentOfYield: a }).map((w) => w.code);

describe('preload F = σ·As', () => {
  it('gives N from MPa and mm² and inverts to stress and % of yield', () => {
    // 360 MPa × 244.79 mm² = 88,124 N (by hand).
    const F = preloadFromStress(360, 244.79);
    expect(F).toBeCloseTo(88_124.4, 6);
    expect(stressFromPreload(F, 244.79)).toBeCloseTo(360, 10);
    expect(percentOfYield(F, 244.79, 720)).toBeCloseTo(50, 10);
    expect(preloadFromPercentOfYield(50, 720, 244.79)).toBeCloseTo(F, 8);
  });

  it('rejects a non-positive stress', () => {
    expect(() => preloadFromStress(0, 100)).toThrow('Target stress must be a positive number.');
  });
});

describe('preloadWarnings thresholds', () => {
  it('says nothing inside the commonly quoted 40–70 % (docs/REFERENCE.md §4, from memory)', () => {
    expect(codes(40)).toEqual([]);
    expect(codes(50)).toEqual([]);
    expect(codes(70)).toEqual([]);
  });

  it('cautions above 70 % as outside the training default and below 40 %', () => {
    expect(codes(70.1)).toEqual(['above-usual-range']);
    const [w] = preloadWarnings({ residualPercentOfYield: 75 });
    expect(w?.severity).toBe('caution');
    expect(w?.message).toContain('above the 40–70 % range this calculator uses as its training default');
    expect(w?.source).toMatch(/^training default: set your own/);
    expect(codes(39.9)).toEqual(['below-usual-range']);
  });

  it('flags over-stress at 100 % of yield and above as danger', () => {
    expect(codes(99.9)).toEqual(['above-usual-range']);
    const w = preloadWarnings({ residualPercentOfYield: 100 });
    expect(w.map((x) => [x.code, x.severity])).toEqual([['over-stress', 'danger']]);
  });

  it('applies the tensioner limits at the applied load: > 75 % caution, > 95 % danger ([TENS1])', () => {
    expect(codes(50, 75)).toEqual([]);
    expect(codes(50, 75.1)).toEqual(['applied-above-75']);
    expect(codes(50, 95)).toEqual(['applied-above-75']);
    const w = preloadWarnings({ residualPercentOfYield: 60, appliedPercentOfYield: 95.5 });
    expect(w.map((x) => [x.code, x.severity])).toEqual([['applied-above-95', 'danger']]);
    expect(w[0]?.source).toBe("the tensioner maker's instructions");
    expect(codes(60, 100)).toEqual(['applied-over-stress']);
  });
});
