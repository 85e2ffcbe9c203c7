/**
 * Root of a continuous function on a bracketing interval [a, b] (f(a) and f(b) of opposite sign or
 * zero) by Brent's method: inverse quadratic interpolation and secant steps, falling back to
 * bisection, so it never leaves the bracket and converges superlinearly on smooth functions.
 *
 * Algorithm: `zeroin` as published by Forsythe, Malcolm & Moler; stops when the bracket is below
 * 2·ε·|x| + tol/2 or f is exactly 0.
 *
 * References: Brent, Algorithms for Minimization without Derivatives (1973) ch. 4; Forsythe,
 * Malcolm & Moler, Computer Methods for Mathematical Computations (1977) §7.2 (zeroin).
 * @throws never (callers ensure a bracket; without one the result is an end point).
 * @example
 * brentRoot((x) => x * x - 2, 0, 2, 1e-15); // 1.4142135623730951
 */
export function brentRoot(f: (x: number) => number, lower: number, upper: number, tol = 0): number {
  let a = lower;
  let b = upper;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < 200; iteration++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + tol / 2;
    const xm = (c - b) / 2;
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * xm * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}
