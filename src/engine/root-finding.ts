/** Result of a bracketed root search. */
export interface RootResult {
  root: number;
  iterations: number;
  converged: boolean;
}

/**
 * Brent's method for a root of a continuous f on [a, b] with f(a)·f(b) ≤ 0
 * (R. P. Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4,
 * procedure "zero"). Inverse quadratic interpolation and secant steps, falling
 * back to bisection, so the iteration count is bounded by `maxIterations`.
 * `fa` and `fb` may be passed when already known. With `valueTolerance`, it also stops as
 * soon as |f| is within it (for an f whose value is itself a temperature error, say).
 */
export function brentRoot(
  f: (x: number) => number,
  a0: number,
  b0: number,
  tolerance: number,
  maxIterations: number,
  fa0: number = f(a0),
  fb0: number = f(b0),
  valueTolerance = 0,
): RootResult {
  let a = a0;
  let b = b0;
  let fa = fa0;
  let fb = fb0;
  if (fa === 0) return { root: a, iterations: 0, converged: true };
  if (fb === 0) return { root: b, iterations: 0, converged: true };
  if ((fa > 0 && fb > 0) || (fa < 0 && fb < 0) || !Number.isFinite(fa) || !Number.isFinite(fb)) {
    // An end already within the value tolerance is a root even where rounding left both ends
    // on one side of zero (a line at the air's own temperature, say).
    if (Number.isFinite(fa) && Number.isFinite(fb) && Math.min(Math.abs(fa), Math.abs(fb)) <= valueTolerance) {
      return { root: Math.abs(fa) <= Math.abs(fb) ? a : b, iterations: 0, converged: true };
    }
    return { root: Number.NaN, iterations: 0, converged: false };
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
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
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || Math.abs(fb) <= valueTolerance) return { root: b, iterations: iteration, converged: true };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return { root: b, iterations: maxIterations, converged: false };
}
