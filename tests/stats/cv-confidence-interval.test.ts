import { describe, expect, it } from 'vitest';
import { cvConfidenceInterval } from '@/lib/stats';
import { relativeError } from './support/lre';
import { type ComparisonFixture, scipyFixture } from './support/scipy-fixtures';

const fx = scipyFixture<ComparisonFixture>('comparisons.json');

describe('cvConfidenceInterval', () => {
  it("cvConfidenceInterval (Vangel's modified McKay) matches the generator's scipy chi2.ppf computation to 1e-9", () => {
    for (const e of fx.vangel!) {
      const r = cvConfidenceInterval(fx.groups[e.group]!, { confidence: e.confidence });
      expect(r.method).toBe("Vangel's modified McKay");
      expect(relativeError(r.cv, e.cv)).toBeLessThan(1e-12);
      expect(relativeError(r.lower, e.lower)).toBeLessThan(1e-9);
      expect(relativeError(r.upper, e.upper!)).toBeLessThan(1e-9);
      expect(r.lower).toBeLessThan(r.cv);
      expect(r.upper).toBeGreaterThan(r.cv);
    }
  });
  it('cvConfidenceInterval rejects a non-positive mean and constant values', () => {
    expect(() => cvConfidenceInterval([-1, -2])).toThrow('cvConfidenceInterval requires a positive mean');
    expect(() => cvConfidenceInterval([3, 3])).toThrow('cvConfidenceInterval requires some variation in the values');
  });
});
