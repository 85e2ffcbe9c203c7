import { StatsError } from './stats-error';
import { assertNumber } from './internal/assert-number';
import { chiSquareUpperTail } from './chi-square-upper-tail';

/** Result of {@link likelihoodRatioTest}. */
export interface LikelihoodRatioTestResult {
  kind: 'likelihoodRatioTest';
  /** 2(ℓ_full − ℓ_reduced). */
  statistic: number;
  df: number;
  pValue: number;
}

/**
 * Likelihood-ratio test of nested models: does the full model (for example log run CV ~ group +
 * attempt with the trainee as cluster) fit better than the reduced one (without the group)?
 * Both log-likelihoods must come from ML fits (REML criteria of models with different fixed effects
 * are not comparable).
 *
 * Algorithm: G = 2(ℓ_full − ℓ_reduced), p = P(χ²_df > G) from `chiSquareUpperTail` (Wilks). A G
 * below 0 by no more than 1e-8·(1 + |ℓ_full|) is optimiser noise and is set to 0; a larger negative G
 * means the models are not nested or not at their optimum, and is refused.
 *
 * References: Wilks, Ann. Math. Statist. 9 (1938) 60–62; Pinheiro & Bates, Mixed-Effects Models in S
 * and S-PLUS (2000) §2.4.1 (ML, not REML, for fixed-effect tests); test reference: lme4's
 * anova(reduced, full) in scripts/generate-mixed-model-fixtures.R.
 *
 * @throws {StatsError} non-finite log-likelihoods, `likelihoodRatioTest requires a positive integer dfDifference (got 0)`,
 *   `likelihoodRatioTest requires a full model at least as likely as the reduced one (got -3 below)`.
 * @example
 * likelihoodRatioTest(-10, -11, 1).pValue; // 0.15729920705028513 (= P(χ²₁ > 2), scipy.stats.chi2.sf(2, 1))
 */
export function likelihoodRatioTest(fullLogLik: number, reducedLogLik: number, dfDifference: number): LikelihoodRatioTestResult {
  const fn = 'likelihoodRatioTest';
  assertNumber(fn, 'fullLogLik', fullLogLik);
  assertNumber(fn, 'reducedLogLik', reducedLogLik);
  assertNumber(fn, 'dfDifference', dfDifference, 'positive');
  if (!Number.isInteger(dfDifference)) throw new StatsError(`${fn} requires a positive integer dfDifference (got ${dfDifference})`);
  const raw = 2 * (fullLogLik - reducedLogLik);
  if (raw < -1e-8 * (1 + Math.abs(fullLogLik))) {
    throw new StatsError(`${fn} requires a full model at least as likely as the reduced one (got ${-raw / 2} below)`);
  }
  const statistic = Math.max(0, raw);
  return { kind: 'likelihoodRatioTest', statistic, df: dfDifference, pValue: chiSquareUpperTail(statistic, dfDifference) };
}
