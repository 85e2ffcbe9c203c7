import { quantile } from '@/lib/stats';

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
 * Box summary of a sample. Quartiles are Hyndman & Fan type 7 (lib/stats `quantile`); whiskers
 * follow Tukey (Exploratory Data Analysis, 1977): the most extreme data within 1.5 × IQR of the box.
 * Returns null for an empty sample. Non-finite values are an error (lib/stats throws).
 */
export function boxStats(values: readonly number[]): BoxStats | null {
  if (values.length === 0) return null;
  // Sorted once (a typed array sorts numerically without a comparator); quantile's answer does not depend on the order.
  const sorted = Array.from(Float64Array.from(values).sort());
  const q1 = quantile(sorted, 0.25);
  const median = quantile(sorted, 0.5);
  const q3 = quantile(sorted, 0.75);
  const iqr = q3 - q1;
  const lowFence = q1 - 1.5 * iqr;
  const highFence = q3 + 1.5 * iqr;
  const inside = sorted.filter((v) => v >= lowFence && v <= highFence);
  return {
    n: values.length,
    q1,
    median,
    q3,
    iqr,
    lowerWhisker: inside[0] ?? q1,
    upperWhisker: inside[inside.length - 1] ?? q3,
    outliers: sorted.filter((v) => v < lowFence || v > highFence),
  };
}
