/**
 * Σ ((xᵢ − centre) / scale)ᵖ for p = 1 or 2, with Kahan–Babuška–Neumaier compensation: the same
 * operations in the same order as simple-statistics `sum(values.map(term))` (start from the first term,
 * correction 0), so the result is identical to the last bit, without allocating the mapped copy and
 * without a closure per call (a term function passed in is not inlined once several are seen, and cost
 * about 20 times the loop: `npm run bench -- compare`). Used in the hot loops of `mean` and `centredSums`.
 *
 * References: Neumaier, ZAMM 54 (1974) 39–51; simple-statistics `sum` (Kahan–Babuška).
 * @throws never (callers validate: finite numbers)
 * @example
 * compensatedSumOfDeviations([1, 2, 3], 2, 1, 1); // 0 (hand computation)
 * compensatedSumOfDeviations([1, 2, 3], 2, 1, 2); // 2 (hand computation)
 */
export function compensatedSumOfDeviations(values: ArrayLike<number>, centre: number, scale: number, power: 1 | 2): number {
  const n = values.length;
  if (n === 0) return 0;
  const e0 = (values[0]! - centre) / scale;
  let total = power === 2 ? e0 * e0 : e0;
  let correction = 0;
  for (let i = 1; i < n; i++) {
    const e = (values[i]! - centre) / scale;
    const x = power === 2 ? e * e : e;
    const transition = total + x;
    if (Math.abs(total) >= Math.abs(x)) correction += total - transition + x;
    else correction += x - transition + total;
    total = transition;
  }
  return total + correction;
}
