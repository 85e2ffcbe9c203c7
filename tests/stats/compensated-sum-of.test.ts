import { sum } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { compensatedSumOfDeviations } from '@/lib/stats/internal/compensated-sum-of';
import { centredSums } from '@/lib/stats/internal/centred-sums';

/** A seeded sample with a large offset (where compensation matters), so the check is repeatable. */
function sample(n: number, offset: number): number[] {
  let seed = 7;
  const rand = () => ((seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31) / 2 ** 31);
  return Array.from({ length: n }, () => offset + rand() * 1e-3 - 5e-4);
}

describe('compensatedSumOfDeviations', () => {
  it('is bit for bit simple-statistics sum of the mapped copy (the operations it replaces)', () => {
    for (const values of [sample(1, 1e7), sample(17, 1e6), sample(1000, 1e7), sample(999, -3)]) {
      const centre = values[0]! + 1e-4;
      expect(compensatedSumOfDeviations(values, centre, 1, 1)).toBe(sum(values.map((v) => v - centre)));
      expect(compensatedSumOfDeviations(values, 0, values.length, 1)).toBe(sum(values.map((v) => v / values.length)));
      expect(compensatedSumOfDeviations(values, centre, 2 ** -20, 1)).toBe(sum(values.map((v) => (v - centre) / 2 ** -20)));
      expect(compensatedSumOfDeviations(values, centre, 2 ** -20, 2)).toBe(sum(values.map((v) => ((v - centre) / 2 ** -20) ** 2)));
    }
    expect(compensatedSumOfDeviations([], 1, 1, 1)).toBe(0);
    expect(compensatedSumOfDeviations([1, 2, 3], 2, 1, 2)).toBe(2);
  });

  it('leaves centredSums as the copy-based two-pass formula gave it', () => {
    const values = sample(500, 1e6 + 0.5);
    const centre = sum(values) / values.length;
    // The formula before the copies were removed: deviations, scaled by a power of two, summed.
    const deviations = values.map((v) => v - centre);
    const scale = 2 ** Math.floor(Math.log2(Math.max(...deviations.map(Math.abs))));
    const scaled = deviations.map((d) => d / scale);
    const q = Math.max(0, sum(scaled.map((e) => e * e)) - sum(scaled) ** 2 / values.length);
    expect(centredSums(values, centre)).toEqual({ scale, q });
  });
});
