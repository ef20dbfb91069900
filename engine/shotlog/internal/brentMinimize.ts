/**
 * Brent's minimisation of a function of one variable on [a, b] (golden-section steps where parabolic
 * interpolation through the three best points is not trustworthy), as in R. P. Brent, Algorithms for
 * Minimization without Derivatives (1973), ch. 5, and Numerical Recipes' `brent`. `x0` (inside [a, b])
 * is the best point known so far. Stops when the bracket is within `tol` (relative to |x|, plus 1e-10)
 * of the best point; returns that point. Internal to fitCalibration.
 */
export function brentMinimize(f: (x: number) => number, a0: number, b0: number, x0: number, tol: number): number {
  const CG = (3 - Math.sqrt(5)) / 2;
  let a = Math.min(a0, b0);
  let b = Math.max(a0, b0);
  let x = x0 > a && x0 < b ? x0 : a + CG * (b - a);
  let w = x,
    v = x;
  let fx = f(x),
    fw = fx,
    fv = fx;
  let d = 0,
    e = 0;
  for (let it = 0; it < 100; it++) {
    const xm = 0.5 * (a + b);
    const tol1 = tol * Math.abs(x) + 1e-10;
    const tol2 = 2 * tol1;
    if (Math.abs(x - xm) <= tol2 - 0.5 * (b - a)) break;
    let golden = true;
    if (Math.abs(e) > tol1) {
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      const eOld = e;
      e = d;
      if (!(Math.abs(p) >= Math.abs(0.5 * q * eOld) || p <= q * (a - x) || p >= q * (b - x))) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = xm - x >= 0 ? tol1 : -tol1;
        golden = false;
      }
    }
    if (golden) {
      e = x >= xm ? a - x : b - x;
      d = CG * e;
    }
    const u = Math.abs(d) >= tol1 ? x + d : x + (d >= 0 ? tol1 : -tol1);
    const fu = f(u);
    if (fu <= fx) {
      if (u >= x) a = x;
      else b = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return x;
}
