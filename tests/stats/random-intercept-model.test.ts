import { describe, expect, it } from 'vitest';
import { likelihoodRatioTest, randomInterceptModel, randomInterceptModels, StatsError } from '@/lib/stats';
import { lme4Fixture } from './support/lme4-fixtures';
import { relativeError } from './support/lre';

const fx = lme4Fixture();
// Source of every expected value below: lme4 1.1.31 (R 4.2.2) via scripts/generate-mixed-model-fixtures.R,
// fields fixef, sqrt(diag(vcov)), VarCorr, logLik and anova(); recorded in the fixture's meta.
const TOLERANCE = 1e-6;

describe('randomInterceptModel against lme4', () => {
  it('the fixture was written by lme4 1.1.31 and holds balanced, unbalanced, zero-variance and group + attempt cases', () => {
    expect(fx.meta.lme4).toBe('1.1.31');
    expect(fx.cases.map((c) => c.name)).toEqual(['balanced', 'unbalanced', 'zeroClusterVariance', 'groupAndAttempt']);
  });

  for (const c of fx.cases) {
    for (const method of ['REML', 'ML'] as const) {
      it(`${c.name} (${c.formula}), ${method}: coefficients, SEs, variances and logLik match lme4 to 1e-6 relative`, () => {
        const expected = c[method];
        const r = randomInterceptModel(c.predictors, c.y, c.clusters, { method });
        expect(r.coefficients).toHaveLength(expected.coefficients.length);
        r.coefficients.forEach((v, i) => expect(relativeError(v, expected.coefficients[i]!)).toBeLessThan(TOLERANCE));
        r.standardErrors.forEach((v, i) => expect(relativeError(v, expected.standardErrors[i]!)).toBeLessThan(TOLERANCE));
        expect(relativeError(r.residualVariance, expected.residualVariance)).toBeLessThan(TOLERANCE);
        expect(relativeError(r.logLikelihood, expected.logLikelihood)).toBeLessThan(TOLERANCE);
        if (expected.clusterVariance === 0) {
          // lme4 reports a singular fit with θ exactly 0; so must we.
          expect(r.clusterVariance).toBe(0);
          expect(r.boundary).toBe(true);
        } else {
          expect(relativeError(r.clusterVariance, expected.clusterVariance)).toBeLessThan(TOLERANCE);
          expect(r.boundary).toBe(false);
        }
        expect(r.numberOfClusters).toBe(new Set(c.clusters).size);
      });
    }
  }

  it('randomInterceptModels (one prepared design, fits on subsets of its columns) matches lme4 on the group + attempt case, full and attempt-only, number for number with randomInterceptModel', () => {
    const c = fx.cases.find((k) => k.name === 'groupAndAttempt')!;
    const last = c.predictors.length - 1;
    const [fullMl, reducedMl, reml] = randomInterceptModels(c.predictors, c.y, c.clusters, [
      { predictors: c.predictors.map((_, j) => j), method: 'ML' },
      { predictors: [last], method: 'ML' },
      { predictors: c.predictors.map((_, j) => j), method: 'REML' },
    ]);
    expect(relativeError(fullMl!.logLikelihood, c.ML.logLikelihood)).toBeLessThan(TOLERANCE);
    expect(relativeError(reml!.logLikelihood, c.REML.logLikelihood)).toBeLessThan(TOLERANCE);
    reml!.standardErrors.forEach((v, i) => expect(relativeError(v, c.REML.standardErrors[i]!)).toBeLessThan(TOLERANCE));
    // The same numbers as separate fits (same centring, same sums): exact equality, not a tolerance.
    expect(fullMl).toEqual(randomInterceptModel(c.predictors, c.y, c.clusters, { method: 'ML' }));
    expect(reducedMl).toEqual(randomInterceptModel([c.predictors[last]!], c.y, c.clusters, { method: 'ML' }));
    expect(reml).toEqual(randomInterceptModel(c.predictors, c.y, c.clusters, { method: 'REML' }));
    expect(() => randomInterceptModels(c.predictors, c.y, c.clusters, [{ predictors: [c.predictors.length], method: 'ML' }])).toThrow(StatsError);
  });

  it('with no cluster effect found, the fixed effects are those of ordinary least squares (lme4 singular fit = OLS)', () => {
    const c = fx.cases.find((k) => k.name === 'zeroClusterVariance')!;
    const r = randomInterceptModel(c.predictors, c.y, c.clusters);
    expect(relativeError(r.coefficients[1]!, c.REML.coefficients[1]!)).toBeLessThan(1e-12);
  });

  it('cluster labels may be numbers or strings: relabelling the clusters does not change the fit (lme4 treats them as factor levels)', () => {
    const c = fx.cases[1]!;
    const numeric = c.clusters.map((label) => Number(label.slice(1)));
    const a = randomInterceptModel(c.predictors, c.y, c.clusters);
    const b = randomInterceptModel(c.predictors, c.y, numeric);
    expect(b.logLikelihood).toBe(a.logLikelihood);
  });

  it('balanced intercept-only REML equals the one-way ANOVA estimate (MSB − MSW)/n when positive (Searle, Casella & McCulloch 1992 §3.7)', () => {
    // Hand: run means 1.5, 4.5, 4.5; MSB = 2·var(1.5, 4.5, 4.5) = 6; MSW = 0.5; (6 − 0.5)/2 = 2.75.
    const r = randomInterceptModel([], [1, 2, 4, 5, 4, 5], ['a', 'a', 'b', 'b', 'c', 'c']);
    expect(relativeError(r.clusterVariance, 2.75)).toBeLessThan(1e-12);
    expect(relativeError(r.residualVariance, 0.5)).toBeLessThan(1e-12);
  });

  it('rejects inputs that cannot be fitted, with the StatsError grammar', () => {
    expect(() => randomInterceptModel([], [1, 2, 3], ['a', 'a', 'a'])).toThrow('randomInterceptModel requires at least two clusters');
    expect(() => randomInterceptModel([], [1, 2], ['a', 'b'])).toThrow('randomInterceptModel requires more observations than clusters (got 2 for 2)');
    expect(() => randomInterceptModel([[1, 2, 3]], [1, 2, 3], ['a', 'b'])).toThrow(
      'randomInterceptModel requires one cluster label per observation (got 2, expected 3)',
    );
    expect(() => randomInterceptModel([[1, 2, 3, 4, 5], [2, 4, 6, 8, 10]], [1, 3, 2, 5, 4], ['a', 'a', 'b', 'b', 'b'])).toThrow(
      'randomInterceptModel requires predictors that are not collinear',
    );
    expect(() => randomInterceptModel([], [1, 1, 2, 2], ['a', 'a', 'b', 'b'])).toThrow('randomInterceptModel requires some variation within clusters');
    expect(() => randomInterceptModel([], [1, Number.NaN, 2], ['a', 'a', 'b'])).toThrow(StatsError);
  });
});

describe('likelihoodRatioTest', () => {
  const lrt = fx.likelihoodRatio;
  it('the group effect from ML fits matches lme4 anova(reduced, full): Chisq, Df, Pr(>Chisq) to 1e-6 relative', () => {
    const c = fx.cases.find((k) => k.name === 'groupAndAttempt')!;
    const full = randomInterceptModel(c.predictors, c.y, c.clusters, { method: 'ML' });
    const reduced = randomInterceptModel(lrt.reducedPredictors, c.y, c.clusters, { method: 'ML' });
    expect(relativeError(reduced.logLikelihood, lrt.reducedLogLik)).toBeLessThan(1e-6);
    const r = likelihoodRatioTest(full.logLikelihood, reduced.logLikelihood, c.predictors.length - lrt.reducedPredictors.length);
    expect(r.df).toBe(lrt.df);
    expect(relativeError(r.statistic, lrt.statistic)).toBeLessThan(1e-6);
    expect(relativeError(r.pValue, lrt.pValue)).toBeLessThan(1e-6);
  });
  it('likelihoodRatioTest(-10, -11, 1) is P(χ²₁ > 2) = 0.15729920705028513 (scipy.stats.chi2.sf(2, 1))', () => {
    expect(relativeError(likelihoodRatioTest(-10, -11, 1).pValue, 0.15729920705028513)).toBeLessThan(1e-14);
  });
  it('refuses a full model clearly less likely than the reduced one and a non-integer df', () => {
    expect(() => likelihoodRatioTest(-12, -11, 1)).toThrow('likelihoodRatioTest requires a full model at least as likely as the reduced one (got 1 below)');
    expect(() => likelihoodRatioTest(-10, -11, 1.5)).toThrow('likelihoodRatioTest requires a positive integer dfDifference (got 1.5)');
  });
});
