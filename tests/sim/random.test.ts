import { describe, expect, it } from 'vitest';
import { createRng } from '@/lib/sim/random';
import { SimInputError } from '@/lib/sim/errors';
import { mean } from './support';

describe('createRng (mulberry32 + Box–Muller)', () => {
  it('gives the same sequence for the same seed', () => {
    const a = createRng(20261201);
    const b = createRng(20261201);
    const seqA = Array.from({ length: 200 }, () => [a.next(), a.normal(), a.uniform(2, 5), a.int(1, 8)]);
    const seqB = Array.from({ length: 200 }, () => [b.next(), b.normal(), b.uniform(2, 5), b.int(1, 8)]);
    expect(seqA).toEqual(seqB);
  });

  it('gives different sequences for different seeds', () => {
    const a = createRng(1);
    const b = createRng(2);
    const same = Array.from({ length: 100 }, () => a.next() === b.next()).filter(Boolean).length;
    expect(same).toBe(0);
  });

  it('agrees with an independent public mulberry32 implementation for seed 1', () => {
    // 0.6270739405881613 is the first draw for seed 1 asserted by an unrelated public repository's
    // own mulberry32 test (found by code search; an independent implementation, not ours).
    expect(createRng(1).next()).toBeCloseTo(0.6270739405881613, 15);
  });

  it('keeps uniform draws in [0, 1) with a mean near 1/2', () => {
    const rng = createRng(7);
    const xs = Array.from({ length: 20_000 }, () => rng.next());
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
    // Standard error of the mean of U(0,1) over 20 000 draws is 0.29/√20000 ≈ 0.002; allow 5 SE.
    expect(Math.abs(mean(xs) - 0.5)).toBeLessThan(0.01);
  });

  it('draws normals with the requested mean and standard deviation', () => {
    const rng = createRng(11);
    const xs = Array.from({ length: 20_000 }, () => rng.normal(10, 2));
    const m = mean(xs);
    const sd = Math.sqrt(xs.reduce((a, x) => a + (x - m) ** 2, 0) / (xs.length - 1));
    // SE of the mean = 2/√20000 ≈ 0.014 and of the SD ≈ 2/√40000 = 0.01; allow about 5 SE.
    expect(Math.abs(m - 10)).toBeLessThan(0.07);
    expect(Math.abs(sd - 2) / 2).toBeLessThan(0.03);
    // About 68.3 % of a normal lies within ±1σ (a property of the normal distribution).
    const within = xs.filter((x) => Math.abs(x - 10) <= 2).length / xs.length;
    expect(within).toBeGreaterThan(0.66);
    expect(within).toBeLessThan(0.7);
  });

  it('clamps clampedNormal at the given number of standard deviations', () => {
    const rng = createRng(3);
    const xs = Array.from({ length: 50_000 }, () => rng.clampedNormal(0, 1, 2));
    expect(Math.max(...xs)).toBeLessThanOrEqual(2);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(-2);
    // P(|z| > 2) ≈ 4.6 %, so the bounds are actually hit.
    expect(xs.filter((x) => x === 2 || x === -2).length).toBeGreaterThan(1000);
  });

  it('draws integers over the whole inclusive range', () => {
    const rng = createRng(5);
    const seen = new Set(Array.from({ length: 2000 }, () => rng.int(1, 6)));
    expect([...seen].sort()).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it('rejects a non-integer seed and bad bounds', () => {
    expect(() => createRng(1.5)).toThrow(SimInputError);
    expect(() => createRng(Number.NaN)).toThrow('createRng requires an integer seed');
    expect(() => createRng(1).int(3, 2)).toThrow(SimInputError);
    expect(() => createRng(1).pick([])).toThrow('Rng.pick requires a non-empty list');
  });
});
