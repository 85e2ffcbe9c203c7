import { describe, expect, it } from 'vitest';
import { lagOneAutocorrelation } from '@/lib/stats';
import { relativeError } from './support/lre';

// NIST StRD certified r(1) values are checked in nist-strd-univariate.test.ts.
describe('lagOneAutocorrelation', () => {
  it('lagOneAutocorrelation of 1, 2, 3, 4 is 0.25 (hand: 1.25/5)', () => {
    expect(relativeError(lagOneAutocorrelation([1, 2, 3, 4]), 0.25)).toBeLessThan(1e-15);
  });
  it('lagOneAutocorrelation of an alternating sequence is −(n − 1)/n (hand)', () => {
    expect(relativeError(lagOneAutocorrelation([1, -1, 1, -1, 1, -1]), -5 / 6)).toBeLessThan(1e-15);
  });
  it('lagOneAutocorrelation is unchanged by a 1e9 offset', () => {
    const base = [0.3, 0.1, 0.4, 0.1, 0.5, 0.9];
    expect(relativeError(lagOneAutocorrelation(base.map((v) => v + 1e9)), lagOneAutocorrelation(base))).toBeLessThan(1e-6);
  });
  it('lagOneAutocorrelation throws on constant data and on NaN', () => {
    expect(() => lagOneAutocorrelation([2, 2, 2])).toThrow('lagOneAutocorrelation requires values that are not all equal');
    expect(() => lagOneAutocorrelation([2, Number.NaN])).toThrow('(got NaN at index 1)');
  });
});
