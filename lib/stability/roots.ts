/** One-dimensional maximisation and root finding on a bracket (allocation-free). */

const INV_PHI = (Math.sqrt(5) - 1) / 2;

/**
 * Golden-section search for the maximum of `f` on [lo, hi] (Kiefer 1953); stops when the
 * bracket is narrower than `tol`. Returns the abscissa; `f` is called about log(range/tol)/0.48 times.
 */
export function maximiseGolden(f: (x: number) => number, lo: number, hi: number, tol: number, maxIter = 200): number {
  let a = lo,
    b = hi;
  let x1 = b - INV_PHI * (b - a),
    x2 = a + INV_PHI * (b - a);
  let f1 = f(x1),
    f2 = f(x2);
  for (let i = 0; i < maxIter && b - a > tol; i++) {
    if (f1 < f2) {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + INV_PHI * (b - a);
      f2 = f(x2);
    } else {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - INV_PHI * (b - a);
      f1 = f(x1);
    }
  }
  return f1 > f2 ? x1 : x2;
}

/**
 * A root of `f` in [lo, hi] where f(lo)·f(hi) ≤ 0, by Brent's method (Brent 1973,
 * Algorithms for Minimization without Derivatives, ch. 4): inverse quadratic interpolation
 * with a bisection safeguard; stops when the bracket is below `tol`.
 */
export function findRootBracketed(
  f: (x: number) => number,
  lo: number,
  hi: number,
  tol: number,
  maxIter = 200,
): number {
  let a = lo,
    b = hi,
    fa = f(a),
    fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  let c = a,
    fc = fa,
    d = b - a,
    e = d;
  for (let i = 0; i < maxIter; i++) {
    if (fb * fc > 0) {
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
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number, q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc,
          r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
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
