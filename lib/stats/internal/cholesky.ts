/**
 * Cholesky factor L (lower triangular, A = LLᵀ) of a small symmetric positive definite matrix, or
 * null when a pivot is not positive (A singular or indefinite to working precision: a pivot below
 * 1e-13 of its diagonal entry counts as zero). With helpers to solve A x = b and to form A⁻¹.
 *
 * References: Golub & Van Loan, Matrix Computations, 4th ed. (2013) §4.2 (Algorithm 4.2.2).
 * @throws never (callers turn null into their own StatsError)
 * @example
 * choleskyFactor([[4, 2], [2, 3]]); // [[2, 0], [1, 1.4142135623730951]]
 */
export function choleskyFactor(a: readonly (readonly number[])[]): number[][] | null {
  const n = a.length;
  const l = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    let diagonal = a[j]![j]!;
    for (let k = 0; k < j; k++) diagonal -= l[j]![k]! ** 2;
    if (!(diagonal > 1e-13 * Math.abs(a[j]![j]!))) return null;
    const root = Math.sqrt(diagonal);
    l[j]![j] = root;
    for (let i = j + 1; i < n; i++) {
      let s = a[i]![j]!;
      for (let k = 0; k < j; k++) s -= l[i]![k]! * l[j]![k]!;
      l[i]![j] = s / root;
    }
  }
  return l;
}

/** Solves L w = b (forward substitution). */
export function forwardSolve(l: readonly (readonly number[])[], b: readonly number[]): number[] {
  const w = new Array<number>(b.length);
  for (let i = 0; i < b.length; i++) {
    let s = b[i]!;
    for (let k = 0; k < i; k++) s -= l[i]![k]! * w[k]!;
    w[i] = s / l[i]![i]!;
  }
  return w;
}

/** Solves (LLᵀ) x = b. */
export function choleskySolve(l: readonly (readonly number[])[], b: readonly number[]): number[] {
  const w = forwardSolve(l, b);
  const x = new Array<number>(b.length);
  for (let i = b.length - 1; i >= 0; i--) {
    let s = w[i]!;
    for (let k = i + 1; k < b.length; k++) s -= l[k]![i]! * x[k]!;
    x[i] = s / l[i]![i]!;
  }
  return x;
}

/** (LLᵀ)⁻¹, column by column. */
export function choleskyInverse(l: readonly (readonly number[])[]): number[][] {
  const n = l.length;
  const columns = Array.from({ length: n }, (_, j) => choleskySolve(l, Array.from({ length: n }, (_, i) => (i === j ? 1 : 0))));
  return Array.from({ length: n }, (_, i) => columns.map((col) => col[i]!));
}
