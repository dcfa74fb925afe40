// Piecewise cubic Hermite interpolation with the Fritsch–Carlson / Fritsch–Butland derivatives, in the
// form SciPy's PchipInterpolator and Moler's pchip use. Only the cell around t is built: a pchip value
// depends on at most four neighbouring nodes, so this equals interpolating over the whole axis.
// Indices are in range by construction.

/** Interior derivative: weighted harmonic mean of the two slopes, zero at a local extremum or flat step. */
export function pchipInteriorDerivative(
  hl: number,
  hr: number,
  ml: number,
  mr: number,
): number {
  if ((ml > 0 && mr > 0) || (ml < 0 && mr < 0)) {
    const w1 = 2 * hr + hl;
    const w2 = hr + 2 * hl;
    return 1 / ((w1 / ml + w2 / mr) / (w1 + w2));
  }
  return 0;
}

/** End derivative: the one-sided three-point formula, limited to keep the shape (Moler's pchip). */
export function pchipEndDerivative(
  h0: number,
  h1: number,
  m0: number,
  m1: number,
): number {
  const d = ((2 * h0 + h1) * m0 - h0 * m1) / (h0 + h1);
  if (Math.sign(d) !== Math.sign(m0)) return 0;
  if (Math.sign(m0) !== Math.sign(m1) && Math.abs(d) > 3 * Math.abs(m0))
    return 3 * m0;
  return d;
}

/** Where `pchipCell` leaves its answers (reused; no allocation per call). */
export const pchipOut = { value: 0, estimate: 0, d0: 0, d1: 0, b0: 0, b1: 0 };

/**
 * pchip on nodes x[xo .. xo+n-1] with values y[yo .. yo+n-1], evaluated at t in cell k (outside the range
 * the end cubic continues, as SciPy does). Only y[k-1 .. k+2] are read.
 *
 * `estimate` is the pchip value minus the cubic Hermite value with plain three-point (parabola) slopes:
 * how much the shape-preserving slopes change the answer. With two nodes (pchip is then linear) it is the
 * linear value minus the nearest node's value; with one node it is 0.
 */
export function pchipCell(
  x: Float64Array,
  xo: number,
  y: Float64Array,
  yo: number,
  n: number,
  k: number,
  t: number,
): void {
  const out = pchipOut;
  if (n === 1) {
    out.value = y[yo]!;
    out.estimate = 0;
    out.d0 = out.d1 = out.b0 = out.b1 = 0;
    return;
  }
  const x0 = x[xo + k]!;
  const x1 = x[xo + k + 1]!;
  const y0 = y[yo + k]!;
  const y1 = y[yo + k + 1]!;
  const h = x1 - x0;
  const m = (y1 - y0) / h;
  const dx = t - x0;
  if (n === 2) {
    out.value = y0 + m * dx;
    out.estimate = out.value - (dx <= x1 - t ? y0 : y1);
    out.d0 = out.d1 = out.b0 = out.b1 = m;
    return;
  }
  let d0: number;
  let b0: number;
  if (k === 0) {
    const h1 = x[xo + 2]! - x1;
    const m1 = (y[yo + 2]! - y1) / h1;
    d0 = pchipEndDerivative(h, h1, m, m1);
    b0 = ((2 * h + h1) * m - h * m1) / (h + h1);
  } else {
    const hl = x0 - x[xo + k - 1]!;
    const ml = (y0 - y[yo + k - 1]!) / hl;
    d0 = pchipInteriorDerivative(hl, h, ml, m);
    b0 = (h * ml + hl * m) / (hl + h);
  }
  let d1: number;
  let b1: number;
  if (k + 2 === n) {
    const hl = x0 - x[xo + k - 1]!;
    const ml = (y0 - y[yo + k - 1]!) / hl;
    d1 = pchipEndDerivative(h, hl, m, ml);
    b1 = ((2 * h + hl) * m - h * ml) / (h + hl);
  } else {
    const hr = x[xo + k + 2]! - x1;
    const mr = (y[yo + k + 2]! - y1) / hr;
    d1 = pchipInteriorDerivative(h, hr, m, mr);
    b1 = (hr * m + h * mr) / (h + hr);
  }
  out.value = hermite(y0, d0, d1, m, h, dx);
  const e0 = d0 - b0;
  const e1 = d1 - b1;
  out.estimate =
    ((((e0 + e1) / (h * h)) * dx + (-2 * e0 - e1) / h) * dx + e0) * dx;
  out.d0 = d0;
  out.d1 = d1;
  out.b0 = b0;
  out.b1 = b1;
}

/** Cubic Hermite on one cell in power form about its left node (the form SciPy evaluates). */
function hermite(
  y0: number,
  d0: number,
  d1: number,
  slope: number,
  h: number,
  dx: number,
): number {
  const c1 = (3 * slope - 2 * d0 - d1) / h;
  const c0 = (d0 + d1 - 2 * slope) / (h * h);
  return ((c0 * dx + c1) * dx + d0) * dx + y0;
}
