/**
 * Σ term(xᵢ) with Kahan–Babuška–Neumaier compensation, the same operations in the same order as
 * simple-statistics `sum(values.map(term))` (start from the first term, correction 0), so the result
 * is identical to the last bit, without allocating the mapped copy. Used in the hot loops of
 * `mean` and `centredSums`.
 *
 * References: Neumaier, ZAMM 54 (1974) 39–51; simple-statistics `sum` (Kahan–Babuška).
 * @throws never (callers validate: finite numbers)
 * @example
 * compensatedSumOf([1, 2, 3], (v) => v - 2); // 0 (hand computation)
 */
export function compensatedSumOf(values: ArrayLike<number>, term: (value: number) => number): number {
  const n = values.length;
  if (n === 0) return 0;
  let total = term(values[0]!);
  let correction = 0;
  for (let i = 1; i < n; i++) {
    const x = term(values[i]!);
    const transition = total + x;
    if (Math.abs(total) >= Math.abs(x)) correction += total - transition + x;
    else correction += x - transition + total;
    total = transition;
  }
  return total + correction;
}
