import fs from 'node:fs';
import path from 'node:path';

/** Reads a JSON fixture written by scripts/generate-scipy-fixtures.py. */
export function scipyFixture<T>(name: string): T {
  const file = path.resolve(__dirname, '../../fixtures/scipy', name);
  return JSON.parse(fs.readFileSync(file, 'utf8')) as T;
}

export interface TestResultFixture {
  statistic: number;
  pValue: number;
  source: string;
}

export interface ComparisonFixture {
  meta: { scipy: string };
  groups: number[][];
  fOneway: TestResultFixture;
  welchAnova: TestResultFixture;
  leveneMean: TestResultFixture;
  leveneMedian: TestResultFixture;
  bartlett: TestResultFixture;
  tukeyHsd: {
    confidence: number;
    pairs: { groupA: number; groupB: number; meanDifference: number; pValue: number; lower: number; upper: number }[];
  };
  welchTTest?: { statistic: number; df: number; pValue: number; lower: number; upper: number };
  varianceRatio?: { statistic: number; dfNumerator: number; dfDenominator: number; pValue: number };
  vangel?: { group: number; confidence: number; cv: number; lower: number; upper: number | null }[];
}
