// Fast evaluation on complete grids without bubble points: every zone's Newton coefficients (or pchip
// derivatives) along pressure are precomputed per grid, so a point costs two table look-ups for the cells
// and a few dozen multiply-adds. Reads and writes typed arrays only; nothing is allocated per point.
// Indices are in range by construction.
import { pchipCell, pchipOut } from "./pchip";
import type { Plan } from "./plan";
import { getPlan, overshootTolerance } from "./plan";
import { checkRange } from "./range";
import type { BatchResult } from "./types";
import { W_EXTRAPOLATED, W_OVERSHOOT } from "./warnings";

/** Newton (and linear, which is Newton of degree 1) on points [from, to). */
export function runNewtonFast(
  plan: Plan,
  ps: Float64Array,
  ts: Float64Array,
  from: number,
  to: number,
  extrapolate: boolean,
  out: BatchResult,
  outOffset: number,
  batch: boolean,
): void {
  const tb = plan.newton!;
  const prep = plan.prep;
  const { N, M, P, T, pAxis, tAxis } = prep;
  const pLo = P[0]!;
  const pHi = P[N - 1]!;
  const tLo = T[0]!;
  const tHi = T[M - 1]!;
  const qp = tb.p.q;
  const vp = tb.p.valueTerms;
  const qt = tb.t.q;
  const vt = tb.t.valueTerms;
  const { coef, zoneLo, zoneHi, zoneMonotone, invT, wp, wt, r, e, d } = tb;
  const px = tb.p.x;
  const tx = tb.t.x;
  const tOrd = tb.t.order;
  const pStart = tb.p.start;
  const tStart = tb.t.start;
  const tAsc = tb.t.asc;
  const newton = plan.method === "newton";
  const eps4 = 4 * Number.EPSILON;

  for (let idx = from; idx < to; idx++) {
    const p = ps[idx]!;
    const t = ts[idx]!;
    let flags = plan.constFlags;
    if (!(p >= pLo && p <= pHi && t >= tLo && t <= tHi)) {
      flags |= checkRange(prep, p, t, extrapolate, batch ? idx : -1);
    }
    // overshoot is judged between the zone's nodes only; outside the table a steady rise continues
    const checkOvershoot = newton && (flags & W_EXTRAPOLATED) === 0;
    // cells and half-cells (the even-degree tie-break): variant = 2k + h
    const kp = pAxis.cell(p);
    const varP = N < 2 ? 0 : 2 * kp + (p - P[kp]! <= P[kp + 1]! - p ? 0 : 1);
    const kt = tAxis.cell(t);
    const varT = M < 2 ? 0 : 2 * kt + (t - T[kt]! <= T[kt + 1]! - t ? 0 : 1);

    // products (p − x0)(p − x1)… of the Newton form, shared by every column
    const pxo = varP * qp;
    wp[0] = 1;
    for (let i = 1; i < qp; i++) wp[i] = wp[i - 1]! * (p - px[pxo + i - 1]!);
    const txo = varT * qt;
    wt[0] = 1;
    for (let i = 1; i < qt; i++) wt[i] = wt[i - 1]! * (t - tx[txo + i - 1]!);

    // step one: each temperature column of the zone gives its value at the target pressure
    let scale = 0;
    for (let c = 0; c < qt; c++) {
      const j = tOrd[txo + c]!;
      const zi = varP * M + j;
      const cb = zi * qp;
      let s = coef[cb]!;
      for (let i = 1; i < vp; i++) s += coef[cb + i]! * wp[i]!;
      r[c] = s;
      e[c] = qp > 1 ? coef[cb + qp - 1]! * wp[qp - 1]! : 0;
      if (c < vt) {
        const a = s < 0 ? -s : s;
        if (a > scale) scale = a;
        if (checkOvershoot && zoneMonotone[zi] === 1 && (s < zoneLo[zi]! || s > zoneHi[zi]!)) flags |= W_OVERSHOOT;
      }
    }

    // step two: along temperature on the new row
    for (let c = 0; c < qt; c++) d[c] = r[c]!;
    for (let l = 1; l < qt; l++) {
      const ib = (varT * qt + l) * qt;
      for (let i = qt - 1; i >= l; i--) d[i] = (d[i]! - d[i - 1]!) * invT[ib + i]!;
    }
    let value = d[0]!;
    for (let i = 1; i < vt; i++) value += d[i]! * wt[i]!;
    const dT = qt > 1 ? d[qt - 1]! * wt[qt - 1]! : 0;
    // the pressure corrections, carried along temperature by the same polynomial
    for (let c = 0; c < vt; c++) d[c] = e[c]!;
    for (let l = 1; l < vt; l++) {
      const ib = (varT * qt + l) * qt;
      for (let i = vt - 1; i >= l; i--) d[i] = (d[i]! - d[i - 1]!) * invT[ib + i]!;
    }
    let dP = d[0]!;
    for (let i = 1; i < vt; i++) dP += d[i]! * wt[i]!;

    if (checkOvershoot && vt > 2) flags |= rowOvershoot(r, tOrd, tAsc, txo, varT * vt, vt, value);

    const o = outOffset + idx - from;
    out.values[o] = value;
    out.errorEstimates[o] = (dP < 0 ? -dP : dP) + (dT < 0 ? -dT : dT) + eps4 * Math.max(scale, value < 0 ? -value : value);
    out.warnings[o] = flags;
    out.pressureStart[o] = pStart[varP]!;
    out.pressureCount[o] = vp;
    out.temperatureStart[o] = tStart[varT]!;
    out.temperatureCount[o] = vt;
    if (flags & W_OVERSHOOT) {
      const alt = pchipAt(plan, p, t);
      out.alternatives[o] = alt.values[0]!;
    } else out.alternatives[o] = value;
  }
}

/**
 * Step-two overshoot: the new row's zone values rise or fall steadily and the value leaves their range.
 * r is in Newton order; asc lists the zone's node indices ascending, tOrd maps Newton order to nodes.
 */
function rowOvershoot(
  r: Float64Array,
  tOrd: Int32Array,
  asc: Int32Array,
  txo: number,
  ao: number,
  vt: number,
  value: number,
): number {
  let up = true;
  let down = true;
  let lo = Infinity;
  let hi = -Infinity;
  let prev = NaN;
  for (let i = 0; i < vt; i++) {
    // find the Newton position of the i-th zone node in ascending order
    const node = asc[ao + i]!;
    let c = 0;
    while (tOrd[txo + c] !== node) c++;
    const y = r[c]!;
    if (y < lo) lo = y;
    if (y > hi) hi = y;
    if (i > 0) {
      if (y < prev) up = false;
      if (y > prev) down = false;
    }
    prev = y;
  }
  if (!(up || down)) return 0;
  const tol = overshootTolerance(lo, hi);
  return value < lo - tol || value > hi + tol ? W_OVERSHOOT : 0;
}

/** pchip value for one point on the same grid (the alternative shown with an overshoot). */
export function pchipAt(plan: Plan, p: number, t: number): BatchResult {
  let pp = plan.pchipPlan;
  if (!pp) {
    pp = getPlan(plan.prep, "pchip", 0, 0);
    plan.pchipPlan = pp;
  }
  pp.singleP[0] = p;
  pp.singleT[0] = t;
  runPchipFast(pp, pp.singleP, pp.singleT, 0, 1, true, pp.single, 0, false);
  return pp.single;
}

/** pchip along pressure for every column, then along temperature, on points [from, to). */
export function runPchipFast(
  plan: Plan,
  ps: Float64Array,
  ts: Float64Array,
  from: number,
  to: number,
  extrapolate: boolean,
  out: BatchResult,
  outOffset: number,
  batch: boolean,
): void {
  const tb = plan.pchip!;
  const prep = plan.prep;
  const { N, M, P, T, V, pAxis, tAxis } = prep;
  const pLo = P[0]!;
  const pHi = P[N - 1]!;
  const tLo = T[0]!;
  const tHi = T[M - 1]!;
  const { d, b, r, e } = tb;
  const eps4 = 4 * Number.EPSILON;
  for (let idx = from; idx < to; idx++) {
    const p = ps[idx]!;
    const t = ts[idx]!;
    let flags = plan.constFlags;
    if (!(p >= pLo && p <= pHi && t >= tLo && t <= tHi)) {
      flags |= checkRange(prep, p, t, extrapolate, batch ? idx : -1);
    }
    const kp = pAxis.cell(p);
    const kt = tAxis.cell(t);
    const jLo = kt > 0 ? kt - 1 : 0;
    const jHi = kt + 2 < M ? kt + 2 : M - 1;
    let scale = 0;
    if (N >= 3) {
      const x0 = P[kp]!;
      const h = P[kp + 1]! - x0;
      const dx = p - x0;
      for (let j = jLo; j <= jHi; j++) {
        const o = j * N + kp;
        const y0 = V[o]!;
        const y1 = V[o + 1]!;
        const d0 = d[o]!;
        const d1 = d[o + 1]!;
        const slope = (y1 - y0) / h;
        const c1 = (3 * slope - 2 * d0 - d1) / h;
        const c0 = (d0 + d1 - 2 * slope) / (h * h);
        const s = ((c0 * dx + c1) * dx + d0) * dx + y0;
        r[j] = s;
        const e0 = d0 - b[o]!;
        const e1 = d1 - b[o + 1]!;
        e[j] = ((((e0 + e1) / (h * h)) * dx + (-2 * e0 - e1) / h) * dx + e0) * dx;
        const a = s < 0 ? -s : s;
        if (a > scale) scale = a;
      }
    } else {
      for (let j = jLo; j <= jHi; j++) {
        pchipCell(P, 0, V, j * N, N, kp, p);
        r[j] = pchipOut.value;
        e[j] = pchipOut.estimate;
        const a = Math.abs(pchipOut.value);
        if (a > scale) scale = a;
      }
    }
    pchipCell(T, 0, r, 0, M, kt, t);
    const value = pchipOut.value;
    const eT = pchipOut.estimate;
    let eP: number;
    if (M < 2) eP = Math.abs(e[0]!);
    else {
      let w = (t - T[kt]!) / (T[kt + 1]! - T[kt]!);
      w = w < 0 ? 0 : w > 1 ? 1 : w;
      eP = (1 - w) * Math.abs(e[kt]!) + w * Math.abs(e[kt + 1]!);
    }
    const o = outOffset + idx - from;
    out.values[o] = value;
    out.errorEstimates[o] = eP + Math.abs(eT) + eps4 * Math.max(scale, Math.abs(value));
    out.warnings[o] = flags;
    out.alternatives[o] = value;
    const pS = kp > 0 ? kp - 1 : 0;
    out.pressureStart[o] = pS;
    out.pressureCount[o] = (kp + 2 < N ? kp + 2 : N - 1) - pS + 1;
    out.temperatureStart[o] = jLo;
    out.temperatureCount[o] = jHi - jLo + 1;
  }
}
