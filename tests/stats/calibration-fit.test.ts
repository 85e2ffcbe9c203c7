import { describe, expect, it } from 'vitest';
import { calibrationFactor, hysteresisError, linearityError } from '@/lib/stats';
import { readRegression } from './support/nist-strd';
import { lre } from './support/lre';
import { referencePath } from './support/reference-path';

// t quantiles: scipy.stats.t.ppf(0.975, 10) = 2.228138851986274 (as in lib/stats/student-t-quantile.ts);
// t(0.975, 2) = 4.302652729749464 (scipy.stats.t.ppf; NIST/SEMATECH e-Handbook §1.3.6.7.2 table: 4.303).
const T_975_DF10 = 2.228138851986274;
const T_975_DF2 = 4.302652729749464;

describe('calibrationFactor', () => {
  it('matches NIST StRD NoInt1 and NoInt2 certified slope and standard deviation (LRE >= 9), interval = B1 ± t·SD', () => {
    // Source: NIST StRD Linear Regression NoInt1/NoInt2, "Certified Regression Statistics" (files in
    // tests/fixtures/reference/nist-strd/regression). The interval is built from the certified B1 and SD.
    for (const name of ['NoInt1', 'NoInt2']) {
      const set = readRegression(referencePath('nist-strd', 'regression', `${name}.dat`));
      const fit = calibrationFactor(set.y, set.x[0]!);
      const b1 = set.coefficients[0]!;
      const sd = set.standardErrors[0]!;
      expect(lre(fit.factor, b1), name).toBeGreaterThanOrEqual(9);
      expect(lre(fit.standardError, sd), name).toBeGreaterThanOrEqual(9);
      const t = name === 'NoInt1' ? T_975_DF10 : T_975_DF2; // NoInt1: n = 11; NoInt2: n = 3
      expect(fit.dfResidual).toBe(name === 'NoInt1' ? 10 : 2);
      expect(fit.lower).toBeCloseTo(b1 - t * sd, 9);
      expect(fit.upper).toBeCloseTo(b1 + t * sd, 9);
    }
  });

  it('fits a hand-worked set: indicated 1, 2, 3; reference 1, 3, 3', () => {
    // Worked by hand: Σxy = 1 + 6 + 9 = 16, Σx² = 1 + 4 + 9 = 14, k = 16/14 = 8/7.
    // Residuals y − kx: 1 − 8/7 = −1/7, 3 − 16/7 = 5/7, 3 − 24/7 = −3/7; SSR = 35/49 = 5/7.
    // s² = SSR/(n − 1) = 5/14; SE(k) = √(s²/Σx²) = √(5/196) = √5/14.
    // 95 % interval: 8/7 ± t(0.975, 2)·√5/14.
    const fit = calibrationFactor([1, 3, 3], [1, 2, 3]);
    expect(fit.factor).toBeCloseTo(8 / 7, 12);
    expect(fit.standardError).toBeCloseTo(Math.sqrt(5) / 14, 12);
    expect(fit.lower).toBeCloseTo(8 / 7 - (T_975_DF2 * Math.sqrt(5)) / 14, 9);
    expect(fit.upper).toBeCloseTo(8 / 7 + (T_975_DF2 * Math.sqrt(5)) / 14, 9);
  });

  it('refuses a confidence outside (0, 1)', () => {
    expect(() => calibrationFactor([1, 2], [1, 2], 1)).toThrow('calibrationFactor requires a confidence in (0, 1) (got 1)');
  });
});

describe('linearityError', () => {
  it('is the largest residual as % of full scale (hand-worked: the set above, residual 5/7 at full scale 3)', () => {
    // Worked by hand: largest |y − kx| = 5/7 (at x = 2); full scale = largest reference = 3;
    // (5/7)/3 × 100 = 500/21 % ≈ 23.81 %.
    expect(linearityError([1, 3, 3], [1, 2, 3], 8 / 7, 3)).toBeCloseTo(500 / 21, 12);
  });

  it('is zero for points on the line (hand: 10, 20, 30 read as 5, 10, 15 with factor 2)', () => {
    expect(linearityError([10, 20, 30], [5, 10, 15], 2, 30)).toBe(0);
  });

  it('refuses a zero full scale', () => {
    expect(() => linearityError([1], [1], 1, 0)).toThrow('linearityError requires a positive full scale (got 0)');
  });
});

describe('hysteresisError', () => {
  it('is k·|x_down − x_up| at equal reference loads (hand: 49.5 up, 50.5 down at 50 kN, k 1, full scale 100 → 1 %)', () => {
    expect(hysteresisError([{ loadingReference: 50, loadingIndicated: 49.5, unloadingReference: 50, unloadingIndicated: 50.5 }], 1, 100)).toBeCloseTo(1, 12);
  });

  it('compares each direction against its own reference load and takes the largest level', () => {
    // Worked by hand, k = 1.02, full scale 80 kN:
    // level 1: up 1.02·39.8 − 40 = 0.596; down 1.02·40.5 − 40.4 = 0.910; |0.910 − 0.596| = 0.314 → 0.3925 %
    // level 2: up 1.02·78.4 − 80 = −0.032; down 1.02·78.6 − 80 = 0.172; |0.204| → 0.255 %
    const levels = [
      { loadingReference: 40, loadingIndicated: 39.8, unloadingReference: 40.4, unloadingIndicated: 40.5 },
      { loadingReference: 80, loadingIndicated: 78.4, unloadingReference: 80, unloadingIndicated: 78.6 },
    ];
    expect(hysteresisError(levels, 1.02, 80)).toBeCloseTo(0.3925, 10);
  });

  it('refuses no levels', () => {
    expect(() => hysteresisError([], 1, 10)).toThrow('hysteresisError requires at least one level');
  });
});
