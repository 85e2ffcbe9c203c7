import type { NormalisedRun } from '@/lib/record/run-types';

/**
 * Hand-worked 4-stud runs for the elastic-interaction tests. The joint obeys an exact model:
 * tightening stud p by Δ raises p by Δ, lowers both neighbours (distance 1) by 0.1Δ and the
 * opposite stud (distance 2) by 0.05Δ. Loads start at 0 N.
 *
 * Pass 1, cross pattern 1-3-2-4, Δ = 100 N each (hand arithmetic):
 *   after step 1 (pos 1): [100, -10,  -5, -10]
 *   after step 2 (pos 3): [ 95, -20,  95, -20]
 *   after step 3 (pos 2): [ 85,  80,  85, -25]
 *   after step 4 (pos 4): [ 75,  75,  75,  75]
 * Pass 2, circular 1-2-3-4, Δ = 10 N each:
 *   after step 5 (pos 1): [ 85,  74, 74.5,  74]
 *   after step 6 (pos 2): [ 84,  84, 73.5, 73.5]
 *   after step 7 (pos 3): [83.5, 83, 83.5, 72.5]
 *   after step 8 (pos 4): [82.5, 82.5, 82.5, 82.5]
 */
export function twoPassFourStudRun(): NormalisedRun {
  const rows: [number, number, number[]][] = [
    [1, 1, [100, -10, -5, -10]],
    [1, 3, [95, -20, 95, -20]],
    [1, 2, [85, 80, 85, -25]],
    [1, 4, [75, 75, 75, 75]],
    [2, 1, [85, 74, 74.5, 74]],
    [2, 2, [84, 84, 73.5, 73.5]],
    [2, 3, [83.5, 83, 83.5, 72.5]],
    [2, 4, [82.5, 82.5, 82.5, 82.5]],
  ];
  return {
    studCount: 4,
    targetLoadN: 80,
    steps: rows.map(([pass, position, loadsN], i) => ({ order: i + 1, pass, position, loadsN })),
  };
}

/** The first pass of {@link twoPassFourStudRun} alone. */
export function onePassFourStudRun(): NormalisedRun {
  const run = twoPassFourStudRun();
  return { ...run, steps: run.steps.slice(0, 4) };
}
