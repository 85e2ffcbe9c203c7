import { describe, expect, it } from 'vitest';
import { cvRatioFromLogCv, gamesHowell, holmAdjust, mean, runsPerGroupForCvRatio, sampleVariance, varianceComponents, varianceComponentsFromSummaries, welchTTest } from '@/lib/stats';
import { fQuantile } from '@/lib/stats/internal/f-quantile';
import { relativeError } from './support/lre';
import { expectPairsToMatch } from './support/pairwise-comparisons';
import { scipyFixture } from './support/scipy-fixtures';

// Every expected value comes from tests/fixtures/scipy/run-level.json, written by
// scripts/generate-multiple-comparison-fixtures.py (scipy 1.10.1, statsmodels 0.13.5; versions in its meta).
interface RunLevelFixture {
  meta: { scipy: string; statsmodels: string };
  gamesHowell: {
    groups: number[][];
    confidence: number;
    pairs: { groupA: number; groupB: number; meanDifference: number; df: number; statistic: number; pValue: number; lower: number; upper: number }[];
  }[];
  holm: { cases: { pValues: number[]; adjusted: number[] }[] };
  runsPerGroup: { grid: { ratio: number; sdLogCv: number; alpha: number; power: number; effectSize: number; exact: number }[] };
  varianceComponents: {
    name: string;
    runs: number[][];
    confidence: number;
    runSize: number;
    msBetween: number;
    msWithin: number;
    withinLower: number;
    withinUpper: number;
    betweenEstimate: number;
    betweenLowerUntruncated: number;
    betweenUpperUntruncated: number;
  }[];
  cvRatio: { groupA: number[]; groupB: number[]; ratio: number; lower: number; upper: number; df: number; statistic: number; pValue: number };
}

const fx = scipyFixture<RunLevelFixture>('run-level.json');

describe('gamesHowell', () => {
  // Tolerances as for tukeyHsd (see expectPairsToMatch); statistic and df are plain arithmetic.
  it('matches the Games–Howell (1976) formula evaluated with scipy.stats.studentized_range (95 % four groups, 90 % three)', () => {
    for (const case_ of fx.gamesHowell) {
      const r = gamesHowell(case_.groups, { confidence: case_.confidence });
      expectPairsToMatch(r.comparisons, case_.pairs);
      r.comparisons.forEach((c, i) => {
        expect(relativeError(c.statistic, case_.pairs[i]!.statistic)).toBeLessThan(1e-10);
        expect(relativeError(c.df, case_.pairs[i]!.df)).toBeLessThan(1e-12);
      });
    }
  });
  it('rejects groups too small for a Welch df of at least 2', () => {
    expect(() => gamesHowell([[1, 2, 3], [1, 2]])).toThrow('gamesHowell requires at least three values of group 2 (got 2)');
    expect(() => gamesHowell([[1, 1, 1], [2, 2, 2]])).toThrow('gamesHowell requires some variation in group 1 or group 2');
  });
});

describe('holmAdjust', () => {
  it('matches statsmodels multipletests(method="holm") to 1e-14, ties and zeros included', () => {
    for (const c of fx.holm.cases) {
      holmAdjust(c.pValues).forEach((v, i) => expect(Math.abs(v - c.adjusted[i]!)).toBeLessThan(1e-14));
    }
  });
  it('rejects an empty family and p-values outside [0, 1]', () => {
    expect(() => holmAdjust([])).toThrow('holmAdjust requires at least one p-value');
    expect(() => holmAdjust([0.2, 1.2])).toThrow('holmAdjust requires p-values between 0 and 1 (got 1.2 at index 1)');
  });
});

describe('runsPerGroupForCvRatio', () => {
  it(`matches statsmodels TTestIndPower().solve_power within 0.01 runs on a grid of ${fx.runsPerGroup.grid.length} designs`, () => {
    for (const g of fx.runsPerGroup.grid) {
      const r = runsPerGroupForCvRatio({ ratio: g.ratio, sdLogCv: g.sdLogCv, alpha: g.alpha, power: g.power });
      expect(relativeError(r.effectSize, g.effectSize)).toBeLessThan(1e-14);
      expect(Math.abs(r.exact - g.exact)).toBeLessThan(0.01);
      expect(r.perGroup).toBe(Math.max(2, Math.ceil(g.exact)));
      expect(r.achievedPower).toBeGreaterThanOrEqual(g.power);
    }
  });
  it('a ratio and its reciprocal need the same runs (|ln r| is symmetric; Cohen 1988 d)', () => {
    expect(runsPerGroupForCvRatio({ ratio: 0.5, sdLogCv: 0.4 }).exact).toBe(runsPerGroupForCvRatio({ ratio: 2, sdLogCv: 0.4 }).exact);
  });
  it('rejects a ratio of 1 and a power not above alpha', () => {
    expect(() => runsPerGroupForCvRatio({ ratio: 1, sdLogCv: 0.3 })).toThrow('runsPerGroupForCvRatio requires a ratio other than 1');
    expect(() => runsPerGroupForCvRatio({ ratio: 1.5, sdLogCv: 0.3, power: 0.04 })).toThrow(
      'runsPerGroupForCvRatio requires a power above alpha (got 0.04 for 0.05)',
    );
    expect(() => runsPerGroupForCvRatio({ ratio: 1.5, sdLogCv: 0 })).toThrow('runsPerGroupForCvRatio requires a positive sdLogCv (got 0)');
  });
});

describe('varianceComponents', () => {
  it('matches the exact chi-square and MLS formulas evaluated with scipy (balanced, unbalanced, no run effect at 90 %) to 1e-9', () => {
    for (const e of fx.varianceComponents) {
      const r = varianceComponents(e.runs, { confidence: e.confidence });
      expect(r.balanced).toBe(e.name === 'balanced' || e.name === 'noRunEffect90');
      expect(relativeError(r.runSize, e.runSize)).toBeLessThan(1e-14);
      expect(relativeError(r.meanSquares.between, e.msBetween)).toBeLessThan(1e-9);
      expect(relativeError(r.withinRun.variance, e.msWithin)).toBeLessThan(1e-9);
      expect(relativeError(r.withinRun.lower, e.withinLower)).toBeLessThan(1e-9);
      expect(relativeError(r.withinRun.upper, e.withinUpper)).toBeLessThan(1e-9);
      expect(relativeError(r.betweenRun.anovaEstimate, e.betweenEstimate)).toBeLessThan(1e-9);
      expect(relativeError(r.betweenRun.lower, Math.max(0, e.betweenLowerUntruncated))).toBeLessThan(1e-9);
      expect(relativeError(r.betweenRun.upper, Math.max(0, e.betweenUpperUntruncated))).toBeLessThan(1e-9);
    }
  });
  it('the MLS lower limit is 0 exactly when MSB/MSW equals F₁₋α/₂(a − 1, N − a) (Ting et al. 1990 construction)', () => {
    // Three runs of two: MSW = 2 (each run ±1 about its mean); scale the run means so MSB/MSW = F.
    const f = fQuantile(0.975, 2, 3);
    const spread = Math.sqrt((f * 2) / 2); // MSB = 2·var(−s, 0, s) = 2s²
    const runs = [-spread, 0, spread].map((m) => [m - 1, m + 1]);
    const r = varianceComponents(runs);
    expect(relativeError(r.meanSquares.between / r.meanSquares.within, f)).toBeLessThan(1e-13);
    expect(Math.abs((r.meanSquares.between - r.meanSquares.within) / 2 - r.betweenRun.anovaEstimate)).toBeLessThan(1e-12);
    expect(r.betweenRun.lower).toBeLessThan(1e-12 * r.betweenRun.upper);
    // Spreading the run means a little moves L above 0, so the truncation at 0 cannot hide a wrong L.
    const slightlyWider = varianceComponents(runs.map((run, i) => run.map((v) => v + (i - 1) * 1e-3)));
    expect(slightlyWider.betweenRun.lower).toBeGreaterThan(0);
  });
  it('from run summaries (size, mean, sample variance) matches the same scipy fixtures to 1e-9, as stored run figures are used', () => {
    for (const e of fx.varianceComponents) {
      const r = varianceComponentsFromSummaries(e.runs.map((run) => ({ n: run.length, mean: mean(run), variance: sampleVariance(run) })), { confidence: e.confidence });
      expect(relativeError(r.meanSquares.between, e.msBetween)).toBeLessThan(1e-9);
      expect(relativeError(r.withinRun.variance, e.msWithin)).toBeLessThan(1e-9);
      expect(relativeError(r.withinRun.lower, e.withinLower)).toBeLessThan(1e-9);
      expect(relativeError(r.betweenRun.anovaEstimate, e.betweenEstimate)).toBeLessThan(1e-9);
      expect(relativeError(r.betweenRun.upper, Math.max(0, e.betweenUpperUntruncated))).toBeLessThan(1e-9);
    }
    expect(() => varianceComponentsFromSummaries([{ n: 2, mean: 1, variance: 1 }, { n: 1, mean: 3, variance: 0 }])).toThrow('varianceComponentsFromSummaries requires at least two values of run 2 (got 1)');
  });
  it('rejects one run, a run of one stud and runs without within-run variation', () => {
    expect(() => varianceComponents([[1, 2, 3]])).toThrow('varianceComponents requires at least two runs');
    expect(() => varianceComponents([[1, 2], [3]])).toThrow('varianceComponents requires at least two values of run 2 (got 1)');
    expect(() => varianceComponents([[1, 1], [3, 3]])).toThrow('varianceComponents requires some variation within runs');
  });
});

describe('cvRatioFromLogCv', () => {
  it('matches scipy.stats.ttest_ind(log a, log b, equal_var=False) t and p, and its Welch interval exponentiated, to 1e-9', () => {
    const e = fx.cvRatio;
    const r = cvRatioFromLogCv(e.groupA, e.groupB);
    expect(relativeError(r.ratio, e.ratio)).toBeLessThan(1e-9);
    expect(relativeError(r.lower, e.lower)).toBeLessThan(1e-9);
    expect(relativeError(r.upper, e.upper)).toBeLessThan(1e-9);
    expect(relativeError(r.df, e.df)).toBeLessThan(1e-9);
    expect(relativeError(r.logDifference / r.standardError, e.statistic)).toBeLessThan(1e-9);
    expect(relativeError(r.pValue, e.pValue)).toBeLessThan(1e-9);
  });
  it('swapping the groups inverts the ratio and its interval (identity)', () => {
    const e = fx.cvRatio;
    const ab = cvRatioFromLogCv(e.groupA, e.groupB);
    const ba = cvRatioFromLogCv(e.groupB, e.groupA);
    expect(relativeError(ba.ratio, 1 / ab.ratio)).toBeLessThan(1e-12);
    expect(relativeError(ba.lower, 1 / ab.upper)).toBeLessThan(1e-12);
    expect(welchTTest(e.groupA, e.groupB).df).not.toBe(ab.df); // the test is on ln CV, not on the CVs
  });
  it('rejects a CV that is not positive', () => {
    expect(() => cvRatioFromLogCv([0.02, 0], [0.01, 0.02])).toThrow('cvRatioFromLogCv requires positive CVs (got 0 at index 1 of group a)');
  });
});
