import { SimInputError } from './errors';

/**
 * The one seeded pseudo-random number generator of the project: the simulator (and through it the
 * Classroom and Record), the invented demo data and the tests all draw from it.
 *
 * Algorithm: **mulberry32**, a 32-bit generator widely reproduced in public JavaScript code
 * (attributed to Tommy Ettinger: from memory, unverified). Its period is 2³²: enough for training
 * data, far too short for cryptography, so never use it for secrets. Normal draws use the **Box–Muller** transform
 * (both values of each pair are used; the second is cached).
 *
 * The same seed always gives the same sequence, on every platform, because the generator uses only
 * 32-bit integer arithmetic (`Math.imul`, `>>>`).
 */
export interface Rng {
  /** The seed this generator was created with (as an unsigned 32-bit integer). */
  readonly seed: number;
  /** A uniform draw in [0, 1). */
  next(): number;
  /** A uniform draw in [min, max). */
  uniform(min: number, max: number): number;
  /** A normal draw with the given mean and standard deviation (Box–Muller). */
  normal(mean?: number, sd?: number): number;
  /**
   * A normal draw truncated by clamping at ±`limit` standard deviations. The simulator uses it for
   * multiplicative factors (1 + CV·z) so that a factor can never go negative.
   */
  clampedNormal(mean: number, sd: number, limit?: number): number;
  /** A uniform integer in [minInclusive, maxInclusive]. */
  int(minInclusive: number, maxInclusive: number): number;
  /** A uniformly chosen element of a non-empty list. */
  pick<T>(items: readonly T[]): T;
  /** A fresh unsigned 32-bit seed drawn from this generator, for a child generator. */
  nextSeed(): number;
}

/**
 * Creates a mulberry32 generator.
 *
 * @param seed any integer (taken modulo 2³²).
 * @throws {SimInputError} when the seed is not an integer.
 * @example
 * const a = createRng(42); const b = createRng(42);
 * a.next() === b.next(); // true: same seed, same sequence
 */
export function createRng(seed: number): Rng {
  if (!Number.isInteger(seed)) {
    throw new SimInputError('createRng requires an integer seed');
  }
  const seed32 = seed >>> 0;
  let state = seed32;
  let spare: number | null = null;

  const next = (): number => {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), 1 | state);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };

  const standardNormal = (): number => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return z;
    }
    // 1 − u lies in (0, 1], so the logarithm is finite.
    const u1 = 1 - next();
    const u2 = next();
    const r = Math.sqrt(-2 * Math.log(u1));
    spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2);
  };

  return {
    seed: seed32,
    next,
    uniform: (min, max) => min + (max - min) * next(),
    normal: (mean = 0, sd = 1) => mean + sd * standardNormal(),
    clampedNormal: (mean, sd, limit = 3) => {
      const z = Math.max(-limit, Math.min(limit, standardNormal()));
      return mean + sd * z;
    },
    int: (minInclusive, maxInclusive) => {
      if (!Number.isInteger(minInclusive) || !Number.isInteger(maxInclusive) || maxInclusive < minInclusive) {
        throw new SimInputError('Rng.int requires integer bounds with min <= max');
      }
      return minInclusive + Math.floor(next() * (maxInclusive - minInclusive + 1));
    },
    pick: <T>(items: readonly T[]): T => {
      if (items.length === 0) throw new SimInputError('Rng.pick requires a non-empty list');
      return items[Math.floor(next() * items.length)] as T;
    },
    nextSeed: () => Math.floor(next() * 4294967296) >>> 0,
  };
}
