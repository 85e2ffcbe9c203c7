import { quantileSorted } from '@/lib/stats';

/** A box-and-whisker summary (Tukey): quartiles by R-7, whiskers at the most extreme values within 1.5 IQR. */
export interface BoxStats {
  n: number;
  q1: number;
  median: number;
  q3: number;
  iqr: number;
  /** Smallest value ≥ q1 − 1.5 IQR. */
  lowerWhisker: number;
  /** Largest value ≤ q3 + 1.5 IQR. */
  upperWhisker: number;
  /** Values outside the whiskers, ascending. */
  outliers: number[];
}

/**
 * Box summary of a sample. Quartiles are Hyndman & Fan type 7 (lib/stats `quantileSorted` on the
 * sample sorted once); whiskers follow Tukey (Exploratory Data Analysis, 1977): the most extreme
 * data within 1.5 × IQR of the box. Returns null for an empty sample. Non-finite values are an
 * error (lib/stats throws). Values already in a typed array are sorted in place (pass a copy to keep them).
 */
export function boxStats(values: readonly number[] | Float64Array): BoxStats | null {
  if (values.length === 0) return null;
  // Sorted once (a typed array sorts numerically without a comparator); the quartiles read it directly.
  const sorted = (values instanceof Float64Array ? values : Float64Array.from(values)).sort();
  const q1 = quantileSorted(sorted, 0.25);
  const median = quantileSorted(sorted, 0.5);
  const q3 = quantileSorted(sorted, 0.75);
  const iqr = q3 - q1;
  const lowFence = q1 - 1.5 * iqr;
  const highFence = q3 + 1.5 * iqr;
  let low = 0;
  while (low < sorted.length && sorted[low]! < lowFence) low++;
  let high = sorted.length;
  while (high > low && sorted[high - 1]! > highFence) high--;
  return {
    n: values.length,
    q1,
    median,
    q3,
    iqr,
    lowerWhisker: high > low ? sorted[low]! : q1,
    upperWhisker: high > low ? sorted[high - 1]! : q3,
    outliers: [...sorted.subarray(0, low), ...sorted.subarray(high)],
  };
}
