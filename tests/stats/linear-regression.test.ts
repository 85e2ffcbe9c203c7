import * as ss from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { multipleLinearRegression, regressionThroughOrigin } from '@/lib/stats';
import { relativeError } from './support/lre';
import { seededUniform } from './support/seeded-random';

// NIST StRD certified values are checked in nist-strd-regression.test.ts; these are the small cases.
describe('multipleLinearRegression', () => {
  it('multipleLinearRegression fits y = 0.5 + 2.3x for 1..4 -> 3, 5, 7, 10 (hand: Sxy 11.5, Sxx 5)', () => {
    const r = multipleLinearRegression([[1, 2, 3, 4]], [3, 5, 7, 10]);
    expect(relativeError(r.coefficients[0]!, 0.5)).toBeLessThan(1e-14);
    expect(relativeError(r.coefficients[1]!, 2.3)).toBeLessThan(1e-14);
    // Hand: residuals 0.2, −0.1, −0.4, 0.3 -> SSR 0.3, s² = 0.15, SE(b1) = √(0.15/5).
    expect(relativeError(r.standardErrors[1]!, Math.sqrt(0.15 / 5))).toBeLessThan(1e-13);
  });
  it('multipleLinearRegression agrees with simple-statistics linearRegression for one predictor on seeded data', () => {
    const x = seededUniform(5, 30, 0, 10);
    const noise = seededUniform(6, 30, -1, 1);
    const y = x.map((v, i) => 3 + 1.7 * v + noise[i]!);
    const r = multipleLinearRegression([x], y);
    const ref = ss.linearRegression(x.map((v, i) => [v, y[i]!]));
    expect(relativeError(r.coefficients[1]!, ref.m)).toBeLessThan(1e-12);
    expect(relativeError(r.coefficients[0]!, ref.b)).toBeLessThan(1e-12);
  });
  it('multipleLinearRegression rejects collinear predictors, too few rows and NaN', () => {
    expect(() => multipleLinearRegression([[1, 2, 3, 4], [2, 4, 6, 8]], [1, 2, 3, 5])).toThrow(
      'multipleLinearRegression requires predictors that are not collinear',
    );
    expect(() => multipleLinearRegression([[1, 2]], [1, 2])).toThrow(
      'multipleLinearRegression requires more observations than parameters (got 2 for 2)',
    );
    expect(() => multipleLinearRegression([[1, Number.NaN, 3]], [1, 2, 3])).toThrow(
      'multipleLinearRegression requires finite values (got NaN at index 1 of predictor 1)',
    );
  });
});

describe('regressionThroughOrigin', () => {
  it('regressionThroughOrigin slope is Σxy/Σx² (hand: x 4,5,6, y 3,4,4 -> 56/77)', () => {
    const r = regressionThroughOrigin([[4, 5, 6]], [3, 4, 4]);
    expect(relativeError(r.coefficients[0]!, 56 / 77)).toBeLessThan(1e-15);
    expect(r.intercept).toBe(false);
  });
  it('regressionThroughOrigin rejects mismatched lengths', () => {
    expect(() => regressionThroughOrigin([[1, 2]], [1, 2, 3])).toThrow(
      'regressionThroughOrigin requires predictor 1 to have as many values as the response (got 2, expected 3)',
    );
  });
});
