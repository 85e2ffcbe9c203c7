import { describe, expect, it } from 'vitest';
import {
  bartlettTest,
  brownForsytheTest,
  cvConfidenceInterval,
  leveneTest,
  nutFactor,
  oneWayAnova,
  readStatisticalResult,
  tukeyHsd,
  varianceRatioTest,
  welchAnova,
  welchTTest,
} from '@/lib/stats';
import type { LeveneTypeResult } from '@/lib/stats';
import { readGear } from './support/gear';

const gear = readGear();
const spread = [
  [100, 101, 99, 100, 100.5, 99.5],
  [90, 110, 95, 105, 85, 115],
];

describe('readStatisticalResult', () => {
  it('reads a significant Levene-type result as "Scatter differs … at the 5 % level (Levene W = …, p = …)"', () => {
    const result: LeveneTypeResult = { kind: 'leveneTest', statistic: 4.1234, dfBetween: 2, dfWithin: 30, pValue: 0.003, groupCount: 3, n: 33 };
    expect(readStatisticalResult(result, { subject: 'these methods' })).toBe(
      'Scatter differs between these methods at the 5 % level (Levene W = 4.12, p = 0.003).',
    );
  });

  it('reads a non-significant result as "No evidence at the 5 % level that …", never as "the same"', () => {
    // GEAR.DAT Brown–Forsythe p ≈ 0.099 (e-Handbook example): not significant at 5 %, significant at 10 %.
    const r = brownForsytheTest(gear);
    expect(readStatisticalResult(r, { subject: 'these batches' })).toBe(
      'No evidence at the 5 % level that scatter differs between these batches (Brown–Forsythe W = 1.71, p = 0.099).',
    );
    expect(readStatisticalResult(r, { subject: 'these batches', alpha: 0.1 })).toMatch(/^Scatter differs between these batches at the 10 % level/);
  });

  it('writes p below 0.001 as "p < 0.001" and names every test kind', () => {
    const [a, b] = spread as [number[], number[]];
    expect(readStatisticalResult(varianceRatioTest(a, b))).toMatch(/^Scatter differs between the two groups at the 5 % level \(F\(5, 5\) = 0\.00, p < 0\.001\)\.$/);
    expect(readStatisticalResult(bartlettTest(gear))).toMatch(/\(Bartlett T = 20\.79, p = 0\.014\)\.$/);
    expect(readStatisticalResult(leveneTest(spread))).toMatch(/Levene W = /);
    expect(readStatisticalResult(oneWayAnova(gear))).toMatch(/^Mean load differs between these groups at the 5 % level \(one-way ANOVA F\(9, 90\) = /);
    expect(readStatisticalResult(welchAnova(spread))).toMatch(/^No evidence at the 5 % level that mean load differs .*Welch's ANOVA F\(1, 5\.\d\)/);
    expect(readStatisticalResult(welchTTest(a, b))).toMatch(/Welch t\(5\.\d\) = /);
  });

  it('reads Tukey HSD as the pairs that differ, with the labels given', () => {
    // scipy.stats.tukey_hsd([1,2,3],[1.5,2.5,3.5],[7,8,9]).pvalue[1, 2] = 0.00126970648512903 -> "p = 0.0013".
    const r = tukeyHsd([[1, 2, 3], [1.5, 2.5, 3.5], [7, 8, 9]]);
    const text = readStatisticalResult(r, { subject: 'methods', groupLabels: ['torque', 'tensioner', 'angle'] });
    expect(text).toMatch(/^Mean load differs at the 5 % level for 2 of 3 pairs of methods \(Tukey HSD\): torque vs angle \(p < 0\.001\), tensioner vs angle \(p = 0\.0013\)\.$/);
  });

  it('reads a CV interval and a nut factor in plain words', () => {
    expect(readStatisticalResult(cvConfidenceInterval([98, 101.5, 99, 100.2, 100.9]))).toMatch(
      /^The CV is 1\.\d % \(95 % confidence interval 0\.\d % to \d\.\d %, Vangel's modified McKay method, n = 5\)\.$/,
    );
    const k = nutFactor({ torque: [180, 420, 570], diameter: [0.02, 0.02, 0.02], force: [50_000, 100_000, 150_000] }, { units: 'SI' });
    expect(readStatisticalResult(k)).toMatch(/^The fitted nut factor is K = 0\.195 \(95 % confidence interval 0\.165 to 0\.225, n = 3/);
  });

  it('readStatisticalResult rejects an unknown kind and a bad alpha', () => {
    expect(() => readStatisticalResult({ kind: 'nope' } as never)).toThrow("readStatisticalResult requires a known result kind (got 'nope')");
    expect(() => readStatisticalResult(brownForsytheTest(gear), { alpha: 2 })).toThrow('readStatisticalResult requires a probability in (0, 1) as alpha (got 2)');
  });
});
