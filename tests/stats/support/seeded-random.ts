/** Deterministic pseudo-random numbers for tests (mulberry32, public-domain algorithm by T. Ettinger). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** n seeded values uniform on [lo, hi). */
export function seededUniform(seed: number, n: number, lo: number, hi: number): number[] {
  const r = seededRandom(seed);
  return Array.from({ length: n }, () => lo + (hi - lo) * r());
}
