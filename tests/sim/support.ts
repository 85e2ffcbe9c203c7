/**
 * Small statistics helpers for the simulator tests, written out here (two-pass variance) so the
 * tests do not lean on the code under test. CV = s/x̄ (docs/REFERENCE.md §9 ✓ [CV]);
 * ± = (max − min)/(max + min), i.e. (αA − 1)/(αA + 1) with αA = max/min (docs/REFERENCE.md §5, computed).
 */
export function mean(xs: readonly number[]): number {
  if (xs.length === 0) throw new Error('mean requires at least one value');
  return xs.reduce((a, b) => a + b, 0) / xs.length;
}

export function sampleCv(xs: readonly number[]): number {
  if (xs.length < 2) throw new Error('sampleCv requires at least two values');
  const m = mean(xs);
  const ss = xs.reduce((a, x) => a + (x - m) ** 2, 0);
  return Math.sqrt(ss / (xs.length - 1)) / m;
}

export function plusMinus(xs: readonly number[]): number {
  const max = Math.max(...xs);
  const min = Math.min(...xs);
  return (max - min) / (max + min);
}

export function seeds(count: number, first = 1): number[] {
  return Array.from({ length: count }, (_, i) => first + i);
}
