import { describe, expect, it } from 'vitest';
import { quantileSorted } from 'simple-statistics';
import { boxStats } from '@/lib/charts/box-stats';
import { fnv1a32, hash32, jitter } from '@/lib/charts/jitter';

describe('boxStats', () => {
  it('quartiles of 1..10 are R-7: Q1 = 3.25, median 5.5, Q3 = 7.75', () => {
    // Hand (Hyndman & Fan type 7): h = (n − 1)p = 9 × 0.25 = 2.25 → x3 + 0.25(x4 − x3) = 3.25;
    // h = 4.5 → 5.5; h = 6.75 → 7 + 0.75 = 7.75. numpy.quantile(range(1, 11), [.25, .5, .75]) agrees.
    const b = boxStats([10, 9, 8, 7, 6, 5, 4, 3, 2, 1])!;
    expect(b.q1).toBe(3.25);
    expect(b.median).toBe(5.5);
    expect(b.q3).toBe(7.75);
    expect(b.iqr).toBe(4.5);
    // simple-statistics 7.12 quantileSorted is documented as numpy "linear" (type 7): cross-check.
    expect(quantileSorted([1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0.25)).toBe(3.25);
  });

  it('whiskers stop at the last value within 1.5 IQR and the rest are outliers (Tukey 1977)', () => {
    // [1, 2, 3, 4, 100]: Q1 = 2, Q3 = 4 (h = 1 and 3), IQR 2, fences −1 and 7 → 100 is an outlier.
    const b = boxStats([1, 2, 3, 4, 100])!;
    expect([b.q1, b.median, b.q3]).toEqual([2, 3, 4]);
    expect(b.lowerWhisker).toBe(1);
    expect(b.upperWhisker).toBe(4);
    expect(b.outliers).toEqual([100]);
  });

  it('returns null for no values and rejects NaN', () => {
    expect(boxStats([])).toBeNull();
    expect(() => boxStats([1, Number.NaN])).toThrow('finite');
  });
});

describe('jitter', () => {
  it('FNV-1a matches the published test vectors ("" → 0x811c9dc5, "a" → 0xe40c292c, "foobar" → 0xbf9cf968; FNV reference test suite, from memory)', () => {
    expect(fnv1a32('')).toBe(0x811c9dc5);
    expect(fnv1a32('a')).toBe(0xe40c292c);
    expect(fnv1a32('foobar')).toBe(0xbf9cf968);
    expect(hash32('a')).not.toBe(hash32('b'));
  });

  it('is deterministic, bounded and spread over the strip', () => {
    const xs = Array.from({ length: 200 }, (_, i) => jitter('dry', i, 0.3));
    expect(xs).toEqual(Array.from({ length: 200 }, (_, i) => jitter('dry', i, 0.3)));
    expect(Math.max(...xs)).toBeLessThanOrEqual(0.3);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(-0.3);
    // Spread: both halves used, and the mean near 0 (uniform on ±0.3 has sd 0.173; 200 draws → se 0.012).
    expect(xs.filter((x) => x < 0).length).toBeGreaterThan(60);
    expect(xs.filter((x) => x > 0).length).toBeGreaterThan(60);
    expect(Math.abs(xs.reduce((a, b) => a + b, 0) / xs.length)).toBeLessThan(0.05);
    expect(jitter('wet', 0, 0.3)).not.toBe(jitter('dry', 0, 0.3));
  });
});
