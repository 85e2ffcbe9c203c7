import fs from 'node:fs';
import path from 'node:path';

/** One fit in tests/fixtures/lme4/random-intercept.json (written by scripts/generate-mixed-model-fixtures.R). */
export interface Lme4Fit {
  coefficients: number[];
  standardErrors: number[];
  clusterVariance: number;
  residualVariance: number;
  logLikelihood: number;
  theta: number;
  source: string;
}

export interface Lme4Case {
  name: string;
  description: string;
  formula: string;
  predictors: number[][];
  y: number[];
  clusters: string[];
  REML: Lme4Fit;
  ML: Lme4Fit;
}

export interface Lme4Fixture {
  meta: { lme4: string; R: string };
  cases: Lme4Case[];
  likelihoodRatio: {
    fullLogLik: number;
    reducedLogLik: number;
    reducedPredictors: number[][];
    statistic: number;
    df: number;
    pValue: number;
    source: string;
  };
}

/** Reads the lme4 fixture file. */
export function lme4Fixture(): Lme4Fixture {
  const file = path.resolve(__dirname, '../../fixtures/lme4/random-intercept.json');
  return JSON.parse(fs.readFileSync(file, 'utf8')) as Lme4Fixture;
}
