/**
 * The power of two nearest below `maxAbs` (2^floor(log2(maxAbs))), used to scale deviations before
 * squaring so that neither overflow (values near 1e300) nor underflow (values near 1e-300) spoils a
 * sum of squares. Dividing by a power of two is exact in binary floating point (outside the
 * subnormal range), so the scaling adds no rounding error.
 *
 * References: Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed. (2002), §27.8 on
 * scaling to avoid overflow (the LAPACK dnrm2 idea).
 * @throws never (returns 1 for 0 or non-finite input)
 * @example
 * powerOfTwoScale(10); // 8
 */
export function powerOfTwoScale(maxAbs: number): number {
  if (!(maxAbs > 0) || !Number.isFinite(maxAbs)) return 1;
  const exponent = Math.floor(Math.log2(maxAbs));
  // 2 ** exponent is exact for -1074 <= exponent <= 1023.
  const scale = 2 ** Math.max(-1022, Math.min(1023, exponent));
  return scale;
}
