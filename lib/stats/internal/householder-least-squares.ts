import { sum } from 'simple-statistics';
import { StatsError } from '../stats-error';
import { powerOfTwoScale } from './power-of-two-scale';

/**
 * Least squares min‖Xb − y‖ by Householder QR (no normal equations). Columns are first scaled by
 * a power of two near their largest magnitude (exact), which equilibrates the problem without
 * adding rounding error. Returns b, the inverse of R (scaled back), so that (XᵀX)⁻¹ = R⁻¹R⁻ᵀ, and
 * the residuals recomputed from the original columns.
 *
 * References: Golub & Van Loan, Matrix Computations, 4th ed. (2013) §5.1–5.3 (Householder QR,
 * least squares); Higham (2002) ch. 19–20.
 * @throws {StatsError} `<fn> requires predictors that are not collinear` when R is numerically singular.
 * @example
 * householderLeastSquares('f', [[1, 2, 3]], [2, 4, 6]).coefficients; // [2]
 */
export function householderLeastSquares(
  fn: string,
  columns: readonly (readonly number[])[],
  y: readonly number[],
): { coefficients: number[]; rInverse: number[][]; residuals: number[] } {
  const p = columns.length;
  const n = y.length;
  const scales = columns.map((c) => powerOfTwoScale(Math.max(...c.map(Math.abs))));
  const a = columns.map((c, j) => c.map((v) => v / scales[j]!));
  const qty = [...y];
  const diag: number[] = [];
  for (let j = 0; j < p; j++) {
    const col = a[j]!;
    let maxAbs = 0;
    for (let i = j; i < n; i++) maxAbs = Math.max(maxAbs, Math.abs(col[i]!));
    const normScale = powerOfTwoScale(maxAbs);
    let ss = 0;
    for (let i = j; i < n; i++) ss += (col[i]! / normScale) ** 2;
    const norm = normScale * Math.sqrt(ss);
    if (norm === 0) throw new StatsError(`${fn} requires predictors that are not collinear`);
    const alpha = col[j]! > 0 ? -norm : norm;
    // v = x − alpha·e1, stored in col[j..]; H = I − 2vvᵀ/(vᵀv), with vᵀv = 2·norm·(norm + |x_j|).
    col[j] = col[j]! - alpha;
    const vtv = 2 * norm * (norm + Math.abs(col[j]! + alpha));
    const apply = (target: number[]): void => {
      let dot = 0;
      for (let i = j; i < n; i++) dot += col[i]! * target[i]!;
      const f = (2 * dot) / vtv;
      for (let i = j; i < n; i++) target[i] = target[i]! - f * col[i]!;
    };
    for (let m = j + 1; m < p; m++) apply(a[m]!);
    apply(qty);
    diag.push(alpha);
  }
  // R: R[j][j] = diag[j], R[j][m] = a[m][j] for m > j.
  const r = (row: number, colIdx: number): number => (row === colIdx ? diag[row]! : a[colIdx]![row]!);
  const maxDiag = Math.max(...diag.map(Math.abs));
  if (diag.some((d) => Math.abs(d) <= maxDiag * n * Number.EPSILON * 16)) {
    throw new StatsError(`${fn} requires predictors that are not collinear`);
  }
  const bScaled = new Array<number>(p).fill(0);
  for (let j = p - 1; j >= 0; j--) {
    let acc = qty[j]!;
    for (let m = j + 1; m < p; m++) acc -= r(j, m) * bScaled[m]!;
    bScaled[j] = acc / r(j, j);
  }
  // R⁻¹ (upper triangular), column by column.
  const rInv: number[][] = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  for (let c = 0; c < p; c++) {
    for (let j = c; j >= 0; j--) {
      let acc = j === c ? 1 : 0;
      for (let m = j + 1; m <= c; m++) acc -= r(j, m) * rInv[m]![c]!;
      rInv[j]![c] = acc / r(j, j);
    }
  }
  const coefficients = bScaled.map((b, j) => b / scales[j]!);
  const rInverse = rInv.map((row, j) => row.map((v) => v / scales[j]!));
  const residuals = y.map((yi, i) => yi - sum(columns.map((c, j) => c[i]! * coefficients[j]!)));
  return { coefficients, rInverse, residuals };
}
