import { describe, expect, it } from 'vitest';
import { reasonInWords } from '@/lib/analysis/reason-in-words';
import { randomInterceptModel } from '@/lib/stats/random-intercept-model';

describe('why a statistic could not be computed, in words', () => {
  it('names operators where the mixed model speaks of clusters, and no function name', () => {
    // Each operator's runs all in one group with the same value: nothing varies within an operator.
    let thrown: unknown;
    try {
      randomInterceptModel([], [1, 1, 2, 2], ['a', 'a', 'b', 'b']);
    } catch (error) {
      thrown = error;
    }
    const words = reasonInWords(thrown);
    expect(words).toMatch(/operators cannot be told apart from the groups/);
    expect(words).not.toMatch(/randomInterceptModel|cluster/);
  });

  it('keeps what is required for other messages and drops the function name', () => {
    expect(reasonInWords(new Error('varianceRatioTest requires some variation in both samples'))).toBe('it needs some variation in both samples');
    expect(reasonInWords('plain words stay')).toBe('plain words stay');
  });
});
