// Fast evaluation on complete grids without bubble points: every zone's Newton coefficients (or pchip
// derivatives) along pressure are precomputed per grid, so a point costs two table look-ups for its cells
// and a few dozen multiply-adds. Reads and writes typed arrays only; nothing is allocated per point.
// Degree [1,1] (linear) and [3,3] (the default) have unrolled kernels; other degrees use the loop kernel,
// which computes the same numbers in the same order. Indices are in range by construction.
import type { AxisIndex } from "./axis";
import { pchipCell, pchipOut } from "./pchip";
import type { Kernel, Plan } from "./plan";
import {
  alternativesOf,
  getPlan,
  overshootTolerance,
  refusePoint,
} from "./plan";
import { checkRange, snapped } from "./range";
import type { BatchResult } from "./types";
import { W_EXTRAPOLATED, W_OVERSHOOT } from "./warnings";
import {
  ESTIMATE_CALIBRATION,
  estimateFactor,
  estimateInfo,
  extrapolatedEstimate,
  extrapolationOut,
} from "./estimate";

/**
 * The fast kernel for a plan, or null when the general evaluator must be used. The Newton kernels leave
 * pressureCount/temperatureCount to the caller: they are the same for every point (the zone sizes).
 */
export function fastKernel(plan: Plan): Kernel | null {
  const tb = plan.newton;
  if (tb) {
    if (
      tb.p.q === 3 &&
      tb.t.q === 3 &&
      tb.p.valueTerms === 2 &&
      tb.t.valueTerms === 2
    )
      return runNewton11;
    if (
      tb.p.q === 5 &&
      tb.t.q === 5 &&
      tb.p.valueTerms === 4 &&
      tb.t.valueTerms === 4
    )
      return runNewton33;
    return runNewtonFast;
  }
  return plan.pchip ? runPchipFast : null;
}

/** Cell search through the axis' lookup table, then at most a step or two of correction. */
function cellIn(ax: AxisIndex, t: number): number {
  const n = ax.n;
  if (n < 2) return 0;
  let b = Math.floor((t - ax.lo) * ax.scale);
  b = b < 0 ? 0 : b > ax.last ? ax.last : b;
  let k = ax.lut[b]!;
  const x = ax.nodes;
  while (k > 0 && t < x[k]!) k--;
  while (k < n - 2 && t >= x[k + 1]!) k++;
  return k;
}

/** Newton of any degree on a complete grid (the loop form). */
function runNewtonFast(
  plan: Plan,
  ps: Float64Array,
  ts: Float64Array,
  from: number,
  to: number,
  reach: number,
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
  const { coef, zoneLo, zoneHi, invT, wp, wt, r, e, d } = tb;
  const px = tb.p.x;
  const tx = tb.t.x;
  const tOrd = tb.t.order;
  const pStart = tb.p.start;
  const tStart = tb.t.start;
  const tAsc = tb.t.asc;
  const newton = plan.method === "newton";
  const eps4 = 4 * Number.EPSILON;
  const { values, errorEstimates, warnings, pressureStart, temperatureStart } =
    out;
  const est = estimateInfo(prep);
  const fac = estimateFactor(plan.method, plan.m);
  const share = ESTIMATE_CALIBRATION.floor;
  const floorOf = est.floor;
  const cellFlags = est.flags;
  const cellsP = est.cellsP;

  for (let idx = from; idx < to; idx++) {
    let p = ps[idx]!;
    let t = ts[idx]!;
    let flags = plan.constFlags;
    if (!(p >= pLo && p <= pHi && t >= tLo && t <= tHi)) {
      const f = checkRange(prep, p, t, reach, batch ? idx : -1, batch);
      if (f < 0) {
        refusePoint(out, outOffset + idx - from, -f);
        continue;
      }
      flags |= f;
      p = snapped.p;
      t = snapped.t;
    }
    // overshoot is judged between the zone's nodes only; outside the table a steady rise continues
    const checkOvershoot = newton && (flags & W_EXTRAPOLATED) === 0;
    // cells and half-cells (the even-degree tie-break): variant = 2k + h
    const kp = cellIn(pAxis, p);
    const varP = N < 2 ? 0 : 2 * kp + (p - P[kp]! <= P[kp + 1]! - p ? 0 : 1);
    const kt = cellIn(tAxis, t);
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
        scale += Math.abs(s);
        if (checkOvershoot && (s < zoneLo[zi]! || s > zoneHi[zi]!))
          flags |= W_OVERSHOOT;
      }
    }

    // step two: along temperature on the new row
    for (let c = 0; c < qt; c++) d[c] = r[c]!;
    for (let l = 1; l < qt; l++) {
      const ib = (varT * qt + l) * qt;
      for (let i = qt - 1; i >= l; i--)
        d[i] = (d[i]! - d[i - 1]!) * invT[ib + i]!;
    }
    let value = d[0]!;
    for (let i = 1; i < vt; i++) value += d[i]! * wt[i]!;
    const dT = qt > 1 ? d[qt - 1]! * wt[qt - 1]! : 0;
    // the pressure corrections, carried along temperature by the same polynomial
    for (let c = 0; c < vt; c++) d[c] = e[c]!;
    for (let l = 1; l < vt; l++) {
      const ib = (varT * qt + l) * qt;
      for (let i = vt - 1; i >= l; i--)
        d[i] = (d[i]! - d[i - 1]!) * invT[ib + i]!;
    }
    let dP = d[0]!;
    for (let i = 1; i < vt; i++) dP += d[i]! * wt[i]!;

    if (checkOvershoot && vt > 2)
      flags |= rowOvershoot(r, tOrd, tAsc, txo, varT * vt, vt, value);

    const o = outOffset + idx - from;
    values[o] = value;
    const cell = kp + kt * cellsP;
    let err =
      fac * (Math.abs(dP) + Math.abs(dT)) +
      share * floorOf[cell]! +
      eps4 * (scale + Math.abs(value));
    flags |= cellFlags[cell]!;
    if (flags & W_EXTRAPOLATED) {
      err = extrapolatedEstimate(prep, err, p, t);
      flags |= extrapolationOut.flags;
    }
    errorEstimates[o] = err;
    warnings[o] = flags;
    pressureStart[o] = pStart[varP]!;
    temperatureStart[o] = tStart[varT]!;
    if (flags & W_OVERSHOOT)
      alternativesOf(out)[o] = pchipAt(plan, p, t).values[0]!;
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

/** Degree [1,1] (linear, or newton [1,1]) on a complete grid with at least 3 nodes per axis. */
function runNewton11(
  plan: Plan,
  ps: Float64Array,
  ts: Float64Array,
  from: number,
  to: number,
  reach: number,
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
  const { coef, invT } = tb;
  const px = tb.p.x;
  const tx = tb.t.x;
  const tOrd = tb.t.order;
  const pStart = tb.p.start;
  const tStart = tb.t.start;
  const pLut = pAxis.lut;
  const pLast = pAxis.last;
  const pScale = pAxis.scale;
  const tLut = tAxis.lut;
  const tLast = tAxis.last;
  const tScale = tAxis.scale;
  const constFlags = plan.constFlags;
  const eps4 = 4 * Number.EPSILON;
  const { values, errorEstimates, warnings, pressureStart, temperatureStart } =
    out;
  const est = estimateInfo(prep);
  const fac = estimateFactor(plan.method, plan.m);
  const share = ESTIMATE_CALIBRATION.floor;
  const floorOf = est.floor;
  const cellFlags = est.flags;
  const cellsP = est.cellsP;

  for (let idx = from; idx < to; idx++) {
    let p = ps[idx]!;
    let t = ts[idx]!;
    let flags = constFlags;
    if (!(p >= pLo && p <= pHi && t >= tLo && t <= tHi)) {
      const f = checkRange(prep, p, t, reach, batch ? idx : -1, batch);
      if (f < 0) {
        refusePoint(out, outOffset + idx - from, -f);
        continue;
      }
      flags |= f;
      p = snapped.p;
      t = snapped.t;
    }
    let b = Math.floor((p - pLo) * pScale);
    b = b < 0 ? 0 : b > pLast ? pLast : b;
    let kp = pLut[b]!;
    while (kp > 0 && p < P[kp]!) kp--;
    while (kp < N - 2 && p >= P[kp + 1]!) kp++;
    b = Math.floor((t - tLo) * tScale);
    b = b < 0 ? 0 : b > tLast ? tLast : b;
    let kt = tLut[b]!;
    while (kt > 0 && t < T[kt]!) kt--;
    while (kt < M - 2 && t >= T[kt + 1]!) kt++;
    const varP = 2 * kp + (p - P[kp]! <= P[kp + 1]! - p ? 0 : 1);
    const varT = 2 * kt + (t - T[kt]! <= T[kt + 1]! - t ? 0 : 1);

    const po = varP * 3;
    const w1 = p - px[po]!;
    const w2 = w1 * (p - px[po + 1]!);
    const to3 = varT * 3;
    const base = varP * M;
    let cb = (base + tOrd[to3]!) * 3;
    const r0 = coef[cb]! + coef[cb + 1]! * w1;
    const e0 = coef[cb + 2]! * w2;
    cb = (base + tOrd[to3 + 1]!) * 3;
    const r1 = coef[cb]! + coef[cb + 1]! * w1;
    const e1 = coef[cb + 2]! * w2;
    cb = (base + tOrd[to3 + 2]!) * 3;
    const r2 = coef[cb]! + coef[cb + 1]! * w1;

    const ib = to3 * 3;
    const i1 = invT[ib + 4]!;
    const a1 = (r1 - r0) * i1;
    const a2 = (r2 - r1) * invT[ib + 5]!;
    const b2 = (a2 - a1) * invT[ib + 8]!;
    const v1 = t - tx[to3]!;
    const value = r0 + a1 * v1;
    const dT = b2 * (v1 * (t - tx[to3 + 1]!));
    const dP = e0 + (e1 - e0) * i1 * v1;

    const o = outOffset + idx - from;
    values[o] = value;
    const cell = kp + kt * cellsP;
    let err =
      fac * (Math.abs(dP) + Math.abs(dT)) +
      share * floorOf[cell]! +
      eps4 * (Math.abs(r0) + Math.abs(r1) + Math.abs(value));
    flags |= cellFlags[cell]!;
    if (flags & W_EXTRAPOLATED) {
      err = extrapolatedEstimate(prep, err, p, t);
      flags |= extrapolationOut.flags;
    }
    errorEstimates[o] = err;
    warnings[o] = flags;
    pressureStart[o] = pStart[varP]!;
    temperatureStart[o] = tStart[varT]!;
  }
}

/** Degree [3,3] (the default) on a complete grid with at least 5 nodes per axis. */
function runNewton33(
  plan: Plan,
  ps: Float64Array,
  ts: Float64Array,
  from: number,
  to: number,
  reach: number,
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
  const { coef, invT, zoneLo, zoneHi, zoneSafe, topT } = tb;
  const vtCount = tb.t.order.length / 5;
  const px = tb.p.x;
  const tx = tb.t.x;
  const tOrd = tb.t.order;
  const pStart = tb.p.start;
  const tStart = tb.t.start;
  const pLut = pAxis.lut;
  const pLast = pAxis.last;
  const pScale = pAxis.scale;
  const tLut = tAxis.lut;
  const tLast = tAxis.last;
  const tScale = tAxis.scale;
  const constFlags = plan.constFlags;
  const newton = plan.method === "newton";
  const eps4 = 4 * Number.EPSILON;
  const { values, errorEstimates, warnings, pressureStart, temperatureStart } =
    out;
  const est = estimateInfo(prep);
  const fac = estimateFactor(plan.method, plan.m);
  const share = ESTIMATE_CALIBRATION.floor;
  const floorOf = est.floor;
  const cellFlags = est.flags;
  const cellsP = est.cellsP;

  for (let idx = from; idx < to; idx++) {
    let p = ps[idx]!;
    let t = ts[idx]!;
    let flags = constFlags;
    if (!(p >= pLo && p <= pHi && t >= tLo && t <= tHi)) {
      const f = checkRange(prep, p, t, reach, batch ? idx : -1, batch);
      if (f < 0) {
        refusePoint(out, outOffset + idx - from, -f);
        continue;
      }
      flags |= f;
      p = snapped.p;
      t = snapped.t;
    }
    let b = Math.floor((p - pLo) * pScale);
    b = b < 0 ? 0 : b > pLast ? pLast : b;
    let kp = pLut[b]!;
    while (kp > 0 && p < P[kp]!) kp--;
    while (kp < N - 2 && p >= P[kp + 1]!) kp++;
    b = Math.floor((t - tLo) * tScale);
    b = b < 0 ? 0 : b > tLast ? tLast : b;
    let kt = tLut[b]!;
    while (kt > 0 && t < T[kt]!) kt--;
    while (kt < M - 2 && t >= T[kt + 1]!) kt++;
    const varP = 2 * kp + (p - P[kp]! <= P[kp + 1]! - p ? 0 : 1);
    const varT = 2 * kt + (t - T[kt]! <= T[kt + 1]! - t ? 0 : 1);

    // Newton products along pressure
    const po = varP * 5;
    const w1 = p - px[po]!;
    const w2 = w1 * (p - px[po + 1]!);
    const w3 = w2 * (p - px[po + 2]!);
    const w4 = w3 * (p - px[po + 3]!);
    // step one on the five columns (four of the zone, then the extra one for the estimate)
    const to5 = varT * 5;
    const base = varP * M;
    const z0 = base + tOrd[to5]!;
    const z1 = base + tOrd[to5 + 1]!;
    const z2 = base + tOrd[to5 + 2]!;
    const z3 = base + tOrd[to5 + 3]!;
    let cb = z0 * 5;
    const r0 =
      coef[cb]! + coef[cb + 1]! * w1 + coef[cb + 2]! * w2 + coef[cb + 3]! * w3;
    cb = z1 * 5;
    const r1 =
      coef[cb]! + coef[cb + 1]! * w1 + coef[cb + 2]! * w2 + coef[cb + 3]! * w3;
    cb = z2 * 5;
    const r2 =
      coef[cb]! + coef[cb + 1]! * w1 + coef[cb + 2]! * w2 + coef[cb + 3]! * w3;
    cb = z3 * 5;
    const r3 =
      coef[cb]! + coef[cb + 1]! * w1 + coef[cb + 2]! * w2 + coef[cb + 3]! * w3;
    cb = (base + tOrd[to5 + 4]!) * 5;
    const r4 =
      coef[cb]! + coef[cb + 1]! * w1 + coef[cb + 2]! * w2 + coef[cb + 3]! * w3;

    // step two: divided differences along temperature (precomputed reciprocal spacings)
    const ib = to5 * 5;
    const a1 = (r1 - r0) * invT[ib + 6]!;
    const a2 = (r2 - r1) * invT[ib + 7]!;
    const a3 = (r3 - r2) * invT[ib + 8]!;
    const a4 = (r4 - r3) * invT[ib + 9]!;
    const b2 = (a2 - a1) * invT[ib + 12]!;
    const b3 = (a3 - a2) * invT[ib + 13]!;
    const b4 = (a4 - a3) * invT[ib + 14]!;
    const c3 = (b3 - b2) * invT[ib + 18]!;
    const c4 = (b4 - b3) * invT[ib + 19]!;
    const d4 = (c4 - c3) * invT[ib + 24]!;
    const v1 = t - tx[to5]!;
    const v2 = v1 * (t - tx[to5 + 1]!);
    const v3 = v2 * (t - tx[to5 + 2]!);
    const value = r0 + a1 * v1 + b2 * v2 + c3 * v3;
    const dT = d4 * (v3 * (t - tx[to5 + 3]!));
    // pressure corrections carried along temperature: their Newton coefficients are precomputed
    const go = (varP * vtCount + varT) * 4;
    const dP =
      w4 *
      (topT[go]! +
        topT[go + 1]! * v1 +
        topT[go + 2]! * v2 +
        topT[go + 3]! * v3);

    if (newton && (flags & W_EXTRAPOLATED) === 0) {
      if (
        zoneSafe[varP * vtCount + varT] === 0 &&
        (r0 < zoneLo[z0]! ||
          r0 > zoneHi[z0]! ||
          r1 < zoneLo[z1]! ||
          r1 > zoneHi[z1]! ||
          r2 < zoneLo[z2]! ||
          r2 > zoneHi[z2]! ||
          r3 < zoneLo[z3]! ||
          r3 > zoneHi[z3]!)
      ) {
        flags |= W_OVERSHOOT;
      }
      // the zone's four columns are in ascending temperature order here
      const up = r0 <= r1 && r1 <= r2 && r2 <= r3;
      const down = r0 >= r1 && r1 >= r2 && r2 >= r3;
      if (up || down) {
        const lo = up ? r0 : r3;
        const hi = up ? r3 : r0;
        if (value < lo || value > hi) {
          const tol = overshootTolerance(lo, hi);
          if (value < lo - tol || value > hi + tol) flags |= W_OVERSHOOT;
        }
      }
    }

    const scale =
      Math.abs(r0) +
      Math.abs(r1) +
      Math.abs(r2) +
      Math.abs(r3) +
      Math.abs(value);
    const o = outOffset + idx - from;
    values[o] = value;
    const cell = kp + kt * cellsP;
    let err =
      fac * (Math.abs(dP) + Math.abs(dT)) +
      share * floorOf[cell]! +
      eps4 * scale;
    flags |= cellFlags[cell]!;
    if (flags & W_EXTRAPOLATED) {
      err = extrapolatedEstimate(prep, err, p, t);
      flags |= extrapolationOut.flags;
    }
    errorEstimates[o] = err;
    warnings[o] = flags;
    pressureStart[o] = pStart[varP]!;
    temperatureStart[o] = tStart[varT]!;
    if (flags & W_OVERSHOOT)
      alternativesOf(out)[o] = pchipAt(plan, p, t).values[0]!;
  }
}

/** pchip value for one point on the same grid (the alternative shown with an overshoot). */
function pchipAt(plan: Plan, p: number, t: number): BatchResult {
  let pp = plan.pchipPlan;
  if (!pp) {
    pp = getPlan(plan.prep, "pchip", 0, 0);
    plan.pchipPlan = pp;
  }
  pp.singleP[0] = p;
  pp.singleT[0] = t;
  runPchipFast(pp, pp.singleP, pp.singleT, 0, 1, Infinity, pp.single, 0, false);
  return pp.single;
}

/** pchip along pressure for every column, then along temperature, on points [from, to). */
function runPchipFast(
  plan: Plan,
  ps: Float64Array,
  ts: Float64Array,
  from: number,
  to: number,
  reach: number,
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
  const { cells, hT, invHT, invSumT, r, e } = tb;
  const eps4 = 4 * Number.EPSILON;
  const stride = (N - 1) * 7;
  const {
    values,
    errorEstimates,
    warnings,
    pressureStart,
    pressureCount,
    temperatureStart,
    temperatureCount,
  } = out;
  const est = estimateInfo(prep);
  const fac = estimateFactor(plan.method, plan.m);
  const share = ESTIMATE_CALIBRATION.floor;
  const floorOf = est.floor;
  const cellFlags = est.flags;
  const cellsP = est.cellsP;
  for (let idx = from; idx < to; idx++) {
    let p = ps[idx]!;
    let t = ts[idx]!;
    let flags = plan.constFlags;
    if (!(p >= pLo && p <= pHi && t >= tLo && t <= tHi)) {
      const f = checkRange(prep, p, t, reach, batch ? idx : -1, batch);
      if (f < 0) {
        refusePoint(out, outOffset + idx - from, -f);
        continue;
      }
      flags |= f;
      p = snapped.p;
      t = snapped.t;
    }
    const kp = cellIn(pAxis, p);
    const kt = cellIn(tAxis, t);
    const jLo = kt > 0 ? kt - 1 : 0;
    const jHi = kt + 2 < M ? kt + 2 : M - 1;
    let scale = 0;
    // step one: the cubic of each needed column's pressure cell, precomputed in powers of (p − P[kp])
    if (N >= 3) {
      const dx = p - P[kp]!;
      for (let j = jLo; j <= jHi; j++) {
        const c = j * stride + kp * 7;
        const s =
          ((cells[c + 3]! * dx + cells[c + 2]!) * dx + cells[c + 1]!) * dx +
          cells[c]!;
        r[j] = s;
        e[j] = ((cells[c + 6]! * dx + cells[c + 5]!) * dx + cells[c + 4]!) * dx;
        scale += Math.abs(s);
      }
    } else {
      for (let j = jLo; j <= jHi; j++) {
        pchipCell(P, 0, V, j * N, N, kp, p);
        r[j] = pchipOut.value;
        e[j] = pchipOut.estimate;
        scale += Math.abs(pchipOut.value);
      }
    }
    // step two: pchip along temperature on the new row, slopes from the (up to) four columns around t
    let value: number;
    let eT: number;
    if (M >= 3) {
      const k = kt;
      const h = hT[k]!;
      const ih = invHT[k]!;
      const y0 = r[k]!;
      const y1 = r[k + 1]!;
      const m = (y1 - y0) * ih;
      let d0: number;
      let b0: number;
      if (k === 0) {
        const h1 = hT[1]!;
        const m1 = (r[2]! - y1) * invHT[1]!;
        b0 = ((2 * h + h1) * m - h * m1) * invSumT[1]!;
        d0 = endSlope(b0, m, m1);
      } else {
        const hl = hT[k - 1]!;
        const ml = (y0 - r[k - 1]!) * invHT[k - 1]!;
        b0 = (h * ml + hl * m) * invSumT[k]!;
        d0 = harmonicSlope(hl, h, ml, m);
      }
      let d1: number;
      let b1: number;
      if (k + 2 === M) {
        const hl = hT[k - 1]!;
        const ml = (y0 - r[k - 1]!) * invHT[k - 1]!;
        b1 = ((2 * h + hl) * m - h * ml) * invSumT[k]!;
        d1 = endSlope(b1, m, ml);
      } else {
        const hr = hT[k + 1]!;
        const mr = (r[k + 2]! - y1) * invHT[k + 1]!;
        b1 = (hr * m + h * mr) * invSumT[k + 1]!;
        d1 = harmonicSlope(h, hr, m, mr);
      }
      const dx = t - T[k]!;
      const c1 = (3 * m - 2 * d0 - d1) * ih;
      const c0 = (d0 + d1 - 2 * m) * ih * ih;
      value = ((c0 * dx + c1) * dx + d0) * dx + y0;
      const e0 = d0 - b0;
      const e1 = d1 - b1;
      eT = (((e0 + e1) * ih * ih * dx + (-2 * e0 - e1) * ih) * dx + e0) * dx;
    } else {
      pchipCell(T, 0, r, 0, M, kt, t);
      value = pchipOut.value;
      eT = pchipOut.estimate;
    }
    let eP: number;
    if (M < 2) eP = e[0]! < 0 ? -e[0]! : e[0]!;
    else {
      let w = (t - T[kt]!) * invHT[kt]!;
      w = w < 0 ? 0 : w > 1 ? 1 : w;
      const ea = e[kt]!;
      const eb = e[kt + 1]!;
      eP = (1 - w) * (ea < 0 ? -ea : ea) + w * (eb < 0 ? -eb : eb);
    }
    const o = outOffset + idx - from;
    values[o] = value;
    const cell = kp + kt * cellsP;
    let err =
      fac * (eP + Math.abs(eT)) +
      share * floorOf[cell]! +
      eps4 * (scale + Math.abs(value));
    flags |= cellFlags[cell]!;
    if (flags & W_EXTRAPOLATED) {
      err = extrapolatedEstimate(prep, err, p, t);
      flags |= extrapolationOut.flags;
    }
    errorEstimates[o] = err;
    warnings[o] = flags;
    const pS = kp > 0 ? kp - 1 : 0;
    pressureStart[o] = pS;
    pressureCount[o] = (kp + 2 < N ? kp + 2 : N - 1) - pS + 1;
    temperatureStart[o] = jLo;
    temperatureCount[o] = jHi - jLo + 1;
  }
}

/** Interior pchip slope (weighted harmonic mean), as pchipInteriorDerivative with one division. */
function harmonicSlope(hl: number, hr: number, ml: number, mr: number): number {
  if ((ml > 0 && mr > 0) || (ml < 0 && mr < 0)) {
    const w1 = 2 * hr + hl;
    const w2 = hr + 2 * hl;
    return ((w1 + w2) * ml * mr) / (w1 * mr + w2 * ml);
  }
  return 0;
}

/** End pchip slope from the three-point slope d (as pchipEndDerivative). */
function endSlope(d: number, m0: number, m1: number): number {
  if (Math.sign(d) !== Math.sign(m0)) return 0;
  if (Math.sign(m0) !== Math.sign(m1) && Math.abs(d) > 3 * Math.abs(m0))
    return 3 * m0;
  return d;
}
