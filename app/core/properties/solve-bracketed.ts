/**
 * Brent's method (R. P. Brent, "Algorithms for Minimization without Derivatives", 1973, ch. 4): a bracketed
 * root finder combining bisection, secant and inverse quadratic interpolation. Given a continuous f with
 * f(a)·f(b) ≤ 0 it always converges; each step keeps a sign-changing bracket.
 */
import { PropertyInputError } from "./errors";

export interface RootResult {
  readonly root: number;
  readonly residual: number;
  readonly iterations: number;
}

export function solveBracketed(
  f: (x: number) => number,
  lower: number,
  upper: number,
  options: { tolerance?: number; maxIterations?: number } = {},
): RootResult {
  const tol = options.tolerance ?? 1e-14;
  const maxIterations = options.maxIterations ?? 200;
  let a = lower;
  let b = upper;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return { root: a, residual: 0, iterations: 0 };
  if (fb === 0) return { root: b, residual: 0, iterations: 0 };
  if (!(fa * fb < 0)) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "bracket",
      [lower, upper],
      `Root is not bracketed: f(${lower}) = ${fa}, f(${upper}) = ${fb}.`,
    );
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
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0)
      return { root: b, residual: fb, iterations: iteration };
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
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
      p = Math.abs(p);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * p < Math.min(min1, min2)) {
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
  // Brent's bracket halves at least every few steps, so with tolerance ≥ 1e-14 and 200 steps this is
  // unreachable for a bracket of width ≤ 1e30; kept as a guard.
  return { root: b, residual: fb, iterations: maxIterations };
}

/**
 * Find the first sign change of f on [lower, upper] scanning `steps` equal sub-intervals, then solve there
 * with Brent's method. Used to pick the low-density (gas) root when an equation of state has several.
 */
export function solveFirstRoot(
  f: (x: number) => number,
  lower: number,
  upper: number,
  steps: number,
  tolerance = 1e-14,
): RootResult {
  let x0 = lower;
  let f0 = f(x0);
  if (f0 === 0) return { root: x0, residual: 0, iterations: 0 };
  for (let k = 1; k <= steps; k++) {
    const x1 = lower + ((upper - lower) * k) / steps;
    const f1 = f(x1);
    if (f1 === 0 || f0 * f1 < 0)
      return solveBracketed(f, x0, x1, { tolerance });
    x0 = x1;
    f0 = f1;
  }
  throw new PropertyInputError(
    "OUT_OF_DOMAIN",
    "bracket",
    [lower, upper],
    `No sign change of the equation found on [${lower}, ${upper}].`,
  );
}
