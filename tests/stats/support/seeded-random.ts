import { createRng } from '@/lib/sim/random';

/** n seeded values uniform on [lo, hi) from the project's one seeded generator (lib/sim/random.ts, mulberry32). */
export function seededUniform(seed: number, n: number, lo: number, hi: number): number[] {
  const rng = createRng(seed);
  return Array.from({ length: n }, () => rng.uniform(lo, hi));
}
