import { describe, expect, it } from 'vitest';
import {
  chiSquareQuantile,
  chiSquareUpperTail,
  fUpperTail,
  studentizedRangeQuantile,
  studentizedRangeUpperTail,
  studentTQuantile,
  studentTUpperTail,
} from '@/lib/stats';
import { relativeError } from './support/lre';
import { scipyFixture } from './support/scipy-fixtures';

interface Fx {
  fSf: { x: number; df1: number; df2: number; value: number }[];
  tSf: { x: number; df: number; value: number }[];
  chi2Sf: { x: number; df: number; value: number }[];
  studentizedRangeSf: { x: number; k: number; df: number; value: number }[];
  tPpf: { p: number; df: number; value: number }[];
  chi2Ppf: { p: number; df: number; value: number }[];
  studentizedRangePpf: { p: number; k: number; df: number; value: number }[];
}
const fx = scipyFixture<Fx>('distributions.json');

describe('upper tails against scipy (tests/fixtures/scipy/distributions.json)', () => {
  it('fUpperTail matches scipy.stats.f.sf to 1e-12 relative, including tails near 1e-20', () => {
    for (const c of fx.fSf) expect(relativeError(fUpperTail(c.x, c.df1, c.df2), c.value)).toBeLessThan(1e-12);
  });
  it('studentTUpperTail matches scipy.stats.t.sf to 1e-12 relative, fractional df included', () => {
    for (const c of fx.tSf) expect(relativeError(studentTUpperTail(c.x, c.df), c.value)).toBeLessThan(1e-12);
  });
  it('chiSquareUpperTail matches scipy.stats.chi2.sf to 1e-12 relative', () => {
    for (const c of fx.chi2Sf) expect(relativeError(chiSquareUpperTail(c.x, c.df), c.value)).toBeLessThan(1e-12);
  });
  // Looser than the other tails on purpose: jstat's port of R's ptukey computes the lower tail,
  // so the p-value is 1 − cdf and carries the cdf's absolute error (observed up to 5e-10 at
  // k = 10, df = 90, i.e. 2.5e-7 relative for p = 0.002). Bound: 1e-9 absolute or 1e-7 relative.
  it('studentizedRangeUpperTail matches scipy.stats.studentized_range.sf to 1e-9 absolute / 1e-7 relative', () => {
    for (const c of fx.studentizedRangeSf) {
      const err = Math.abs(studentizedRangeUpperTail(c.x, c.k, c.df) - c.value);
      expect(err).toBeLessThan(Math.max(1e-9, 1e-7 * c.value));
    }
  });
  it('upper tails keep relative accuracy where 1 − cdf would round to 0', () => {
    // Exact: for 2 df chi-square, P(X > x) = e^(−x/2); x = 100 gives e^−50 ≈ 1.9e-22.
    expect(relativeError(chiSquareUpperTail(100, 2), Math.exp(-50))).toBeLessThan(1e-13);
    // Exact: F(2, 2) upper tail = 1/(1 + f); f = 1e15.
    expect(relativeError(fUpperTail(1e15, 2, 2), 1 / (1 + 1e15))).toBeLessThan(1e-13);
  });
  it('tail functions validate their arguments', () => {
    expect(() => fUpperTail(-1, 2, 3)).toThrow('fUpperTail requires a non-negative f (got -1)');
    expect(() => studentTUpperTail(Number.NaN, 3)).toThrow('studentTUpperTail requires a finite t (got NaN)');
    expect(() => chiSquareUpperTail(1, 0)).toThrow('chiSquareUpperTail requires a positive df (got 0)');
    expect(() => studentizedRangeUpperTail(1, 1, 10)).toThrow('studentizedRangeUpperTail requires at least two means (got 1)');
  });
});

describe('quantiles against scipy', () => {
  it('studentTQuantile matches scipy.stats.t.ppf to 1e-13 relative (jstat alone was 1e-8)', () => {
    for (const c of fx.tPpf) expect(relativeError(studentTQuantile(c.p, c.df), c.value)).toBeLessThan(1e-13);
  });
  it('chiSquareQuantile matches scipy.stats.chi2.ppf to 1e-13 relative', () => {
    for (const c of fx.chi2Ppf) expect(relativeError(chiSquareQuantile(c.p, c.df), c.value)).toBeLessThan(1e-13);
  });
  it('studentizedRangeQuantile matches scipy.stats.studentized_range.ppf to 1e-8 relative', () => {
    for (const c of fx.studentizedRangePpf) {
      expect(relativeError(studentizedRangeQuantile(c.p, c.k, c.df), c.value)).toBeLessThan(1e-8);
    }
  });
  it('quantiles reject p outside (0, 1)', () => {
    expect(() => studentTQuantile(1, 3)).toThrow('studentTQuantile requires a probability in (0, 1) as p (got 1)');
    expect(() => chiSquareQuantile(0, 3)).toThrow('chiSquareQuantile requires a probability in (0, 1) as p (got 0)');
  });
});
