// The general evaluator: tables with missing cells and/or bubble points. Each temperature column keeps
// its own list of measured nodes on the point's branch, the zones are chosen on those lists by the same
// zone rule, and the work happens in preallocated scratch arrays (nothing is allocated per point unless a
// trace is asked for, which only `explainInterpolation` does). Indices are in range by construction.
import { cellOf, orderedZone, zoneStart } from "./axis";
import { formatInMessage } from "../format";
import { InterpolationError } from "./errors";
import { dividedDifferences, newtonOut, newtonTerms } from "./newton";
import { pchipCell, pchipOut } from "./pchip";
import type { Plan } from "./plan";
import {
  alternativesOf,
  getPlan,
  overshootTolerance,
  refusePoint,
  STRIDE,
} from "./plan";
import type { BranchNodes, PreparedGrid } from "./prepare";
import { checkRange, R_NO_VALID_ZONE, snapped } from "./range";
import {
  ESTIMATE_CALIBRATION,
  estimateFactor,
  estimateInfo,
  extrapolatedEstimate,
  extrapolationOut,
} from "./estimate";
import type { BatchResult, Stencil, StencilColumn } from "./types";
import {
  W_BRANCH_EXTRAPOLATED,
  W_BUBBLE_POINT_EXTRAPOLATED,
  W_DEGREE_REDUCED,
  W_ESTIMATE_UNAVAILABLE,
  W_ESTIMATE_UNRELIABLE,
  W_EXTRAPOLATED,
  W_MISSING_DATA,
  W_OVERSHOOT,
} from "./warnings";

/**
 * A node as shown to a person. `index` is the grid row (step one, along pressure) or the grid column (step
 * two, along temperature); null for a bubble-point node that lies between grid rows.
 */
type TraceNode = {
  coordinate: number;
  value: number;
  index: number | null;
  role: "zone" | "error-check";
};

export type TraceStep = {
  /** Grid column (step one) or −1 (step two, along temperature). */
  column: number;
  role: "zone" | "error-check";
  status: "inside" | "branch-extrapolated" | "extrapolated";
  /** Nodes in the order used: Newton order for newton/linear, ascending for pchip. */
  nodes: TraceNode[];
  value: number;
  /** Newton: the last term (see README); pchip: pchip minus the three-point-slope cubic. */
  correction: number;
  pchip?: {
    cell: [number, number];
    derivatives: [number, number];
    threePointDerivatives: [number, number];
  };
};

export type Trace = {
  stepOne: TraceStep[];
  stepTwo: TraceStep | null;
  errorPressure: number;
  errorTemperature: number;
  /** The calibration applied to the raw parts (README "Error estimate"). */
  errorFactor: number;
  errorFloor: number;
  errorRounding: number;
  errorGrowth: number;
};

const STATUS = ["inside", "branch-extrapolated", "extrapolated"] as const;

/**
 * Evaluates one point; writes entry `o` of `out`. pointIndex < 0 for a single point (a point that cannot
 * be served throws); pointIndex ≥ 0 in the typed batch path (such a point is refused: see `refusePoint`).
 * `reach` as in range.ts `checkRange`.
 */
export function evaluateGeneral(
  plan: Plan,
  p0: number,
  t0: number,
  reach: number,
  out: BatchResult,
  o: number,
  pointIndex: number,
  trace: Trace | null,
): void {
  const prep = plan.prep;
  const sc = plan.scratch;
  const { M, T } = prep;
  const refuse = pointIndex >= 0;
  const extrapolate = reach > 0;
  const range = checkRange(prep, p0, t0, reach, pointIndex, refuse);
  if (range < 0) {
    refusePoint(out, o, -range);
    return;
  }
  let flags = plan.constFlags | range;
  // snapping (README, "Snapping"): a coordinate within the tolerance of an axis end is that end (done by
  // checkRange); within the tolerance of a column's first or last measured node, of the first or last
  // usable column, or of the bubble point, it counts as on that node (inside, on the node's branch)
  const p = snapped.p;
  const t = snapped.t;
  const pTol = prep.pSnap;

  let b = 0;
  sc.pbStar = NaN;
  if (prep.bubble) {
    const pb = bubblePointAt(plan, t);
    sc.pbStar = pb;
    if (t < prep.bubble.knownLo || t > prep.bubble.knownHi)
      flags |= W_BUBBLE_POINT_EXTRAPOLATED;
    b = p <= pb + pTol ? 1 : 2;
  }
  sc.branch = b;
  const br = prep.branches[b]!;

  // Columns that can give a value at this pressure on this branch.
  let nu = 0;
  for (let j = 0; j < M; j++) {
    const off = br.off[j]!;
    const cnt = br.off[j + 1]! - off;
    if (cnt === 0) continue;
    let status = 0;
    if (p < br.x[off]! - pTol) {
      if (br.bubbleFirst[j]) status = 1;
      else if (extrapolate) status = 2;
      else continue;
    } else if (p > br.x[off + cnt - 1]! + pTol) {
      if (br.bubbleLast[j]) status = 1;
      else if (extrapolate) status = 2;
      else continue;
    }
    sc.usable[nu] = j;
    sc.ux[nu] = T[j]!;
    sc.status[nu] = status;
    nu++;
  }
  const tTol = prep.tSnap;
  const tOutside =
    nu > 0 && (t < sc.ux[0]! - tTol || t > sc.ux[nu - 1]! + tTol);
  if (nu === 0 || (tOutside && !extrapolate)) {
    if (refuse) {
      if (out.branches) out.branches[o] = b;
      refusePoint(out, o, R_NO_VALID_ZONE);
      return;
    }
    throw noValidZone(prep, br, b, p, t, nu, sc.ux, pointIndex);
  }
  if (tOutside) flags |= W_EXTRAPOLATED;
  // one usable column and another temperature, or (below) a zone column with a single node on this
  // branch and another pressure: the table says nothing about the error in that direction
  let silent = nu === 1 && Math.abs(t - sc.ux[0]!) > tTol;

  const isNewton = plan.method !== "pchip";
  let value: number;
  let errP: number;
  let errT: number;
  let scale = 0;
  if (isNewton) {
    const nEff = Math.min(plan.n, nu - 1);
    if (nEff < plan.n && M > 1) flags |= W_DEGREE_REDUCED;
    const kT = cellOf(sc.ux, 0, nu, t);
    const qT = orderedZone(sc.ux, 0, nu, t, nEff, kT, sc.tOrd, 0);
    const vT = nEff + 1;
    sc.nCols = vT;
    for (let c = 0; c < qT; c++) {
      const u = sc.tOrd[c]!;
      const j = sc.usable[u]!;
      sc.tx[c] = sc.ux[u]!;
      const zone = c < vT;
      if (zone) flags |= statusFlag(sc.status[u]!);
      if (zone && singleNodeElsewhere(br, j, p)) silent = true;
      flags |= newtonColumn(plan, br, j, p, c, zone);
      if (zone) scale += Math.abs(sc.r[c]!);
      if (trace)
        trace.stepOne.push(
          traceNewtonColumn(plan, br, j, c, zone, sc.status[u]!),
        );
    }
    // step two along temperature on the new row; then the pressure corrections along temperature
    for (let c = 0; c < qT; c++) sc.d[c] = sc.r[c]!;
    dividedDifferences(sc.tx, 0, sc.d, 0, qT);
    newtonTerms(sc.tx, 0, sc.d, 0, qT, vT, t);
    value = newtonOut.value;
    errT = newtonOut.last;
    for (let c = 0; c < vT; c++) sc.d[c] = sc.e[c]!;
    dividedDifferences(sc.tx, 0, sc.d, 0, vT);
    newtonTerms(sc.tx, 0, sc.d, 0, vT, vT, t);
    errP = newtonOut.value;
    if (
      plan.method === "newton" &&
      vT > 2 &&
      rowOvershoot(sc.r, sc.tx, vT, t, value)
    )
      flags |= W_OVERSHOOT;
    if (trace) {
      const nodes: TraceNode[] = [];
      for (let c = 0; c < qT; c++) {
        const column = sc.usable[sc.tOrd[c]!]!;
        nodes.push({
          coordinate: sc.tx[c]!,
          value: sc.r[c]!,
          index: column,
          role: c < vT ? "zone" : "error-check",
        });
      }
      trace.stepTwo = {
        column: -1,
        role: "zone",
        status: "inside",
        nodes,
        value,
        correction: errT,
      };
    }
  } else {
    const kT = cellOf(sc.ux, 0, nu, t);
    const uLo = nu < 2 ? 0 : Math.max(0, kT - 1);
    const uHi = nu < 2 ? 0 : Math.min(nu - 1, kT + 2);
    if (nu < 2 && M > 1) flags |= W_DEGREE_REDUCED;
    sc.nCols = uHi - uLo + 1;
    for (let u = uLo; u <= uHi; u++) {
      const j = sc.usable[u]!;
      flags |= statusFlag(sc.status[u]!);
      if (singleNodeElsewhere(br, j, p)) silent = true;
      const c = u - uLo;
      const off = br.off[j]!;
      const cnt = br.off[j + 1]! - off;
      if (cnt < 2 && prep.N > 1) flags |= W_DEGREE_REDUCED;
      const k = cellOf(br.x, off, cnt, p);
      pchipCell(br.x, off, br.y, off, cnt, k, p);
      sc.r[u] = pchipOut.value;
      sc.e[u] = pchipOut.estimate;
      scale += Math.abs(pchipOut.value);
      sc.cols[c] = j;
      sc.colOff[c] = off;
      sc.vFrom[c] = cnt < 2 ? 0 : Math.max(0, k - 1);
      sc.vTo[c] = cnt < 2 ? 0 : Math.min(cnt - 1, k + 2);
      if (trace)
        trace.stepOne.push(
          tracePchip(br.x, br.y, br.row, off, cnt, k, j, sc.status[u]!),
        );
    }
    pchipCell(sc.ux, 0, sc.r, 0, nu, kT, t);
    value = pchipOut.value;
    errT = pchipOut.estimate;
    if (nu < 2) errP = Math.abs(sc.e[0]!);
    else {
      const w = Math.min(
        1,
        Math.max(0, (t - sc.ux[kT]!) / (sc.ux[kT + 1]! - sc.ux[kT]!)),
      );
      errP = (1 - w) * Math.abs(sc.e[kT]!) + w * Math.abs(sc.e[kT + 1]!);
    }
    if (trace) {
      trace.stepTwo = tracePchip(sc.ux, sc.r, sc.usable, 0, nu, kT, -1, 0);
    }
  }
  if (!prep.complete && idealZoneHasGap(plan, br, p, t))
    flags |= W_MISSING_DATA;

  // the calibrated estimate (estimate.ts): factor × raw parts + rounding floor, grown outside the table
  const info = estimateInfo(prep);
  const cell = prep.pAxis.cell(p) + prep.tAxis.cell(t) * info.cellsP;
  const factor = estimateFactor(plan.method, plan.m);
  const floor = ESTIMATE_CALIBRATION.floor * info.floor[cell]!;
  const rounding = 4 * Number.EPSILON * (scale + Math.abs(value));
  let err = factor * (Math.abs(errP) + Math.abs(errT)) + floor + rounding;
  let growth = 1;
  flags |= info.flags[cell]!;
  if (flags & W_MISSING_DATA) flags |= W_ESTIMATE_UNRELIABLE;
  if (silent) {
    err = NaN;
    growth = NaN;
    flags |= W_ESTIMATE_UNAVAILABLE;
  } else if (flags & W_EXTRAPOLATED) {
    const inside = err;
    err = extrapolatedEstimate(prep, err, p, t);
    flags |= extrapolationOut.flags;
    growth = err / inside;
  }
  if (trace) {
    trace.errorPressure = errP;
    trace.errorTemperature = errT;
    trace.errorFactor = factor;
    trace.errorFloor = floor;
    trace.errorRounding = rounding;
    trace.errorGrowth = growth;
  }
  out.values[o] = value;
  out.errorEstimates[o] = err;
  out.warnings[o] = flags;
  if (out.branches) out.branches[o] = b;
  writeStencilSpan(plan, br, out, o);
  if (flags & W_OVERSHOOT) {
    let pp = plan.pchipPlan;
    if (!pp) {
      pp = getPlan(prep, "pchip", 0, 0);
      plan.pchipPlan = pp;
    }
    // the pchip plan has its own scratch; the stencil of this plan's scratch stays intact
    evaluateGeneral(pp, p, t, Infinity, pp.single, 0, -1, null);
    alternativesOf(out)[o] = pp.single.values[0]!;
  }
}

/** Column j has a single node on this branch and p is not at it. */
function singleNodeElsewhere(br: BranchNodes, j: number, p: number): boolean {
  const off = br.off[j]!;
  return br.off[j + 1]! - off === 1 && p !== br.x[off]!;
}

function statusFlag(status: number): number {
  return status === 1
    ? W_BRANCH_EXTRAPOLATED
    : status === 2
      ? W_EXTRAPOLATED
      : 0;
}

/**
 * Step one for the c-th column of the temperature zone: the zone rule on this column's own nodes, Newton
 * divided differences, value (sc.r[c]) and last term (sc.e[c]). Returns warning flags.
 */
function newtonColumn(
  plan: Plan,
  br: BranchNodes,
  j: number,
  p: number,
  c: number,
  zone: boolean,
): number {
  const sc = plan.scratch;
  const off = br.off[j]!;
  const cnt = br.off[j + 1]! - off;
  const m = Math.min(plan.m, cnt - 1);
  let flags = 0;
  if (zone && m < plan.m && plan.prep.N > 1) flags |= W_DEGREE_REDUCED;
  const k = cellOf(br.x, off, cnt, p);
  const po = c * STRIDE;
  const q = orderedZone(br.x, off, cnt, p, m, k, sc.pOrd, po);
  let lo = cnt;
  let hi = -1;
  for (let i = 0; i < q; i++) {
    const li = sc.pOrd[po + i]!;
    sc.xs[i] = br.x[off + li]!;
    sc.cs[i] = br.y[off + li]!;
    if (i <= m) {
      lo = Math.min(lo, li);
      hi = Math.max(hi, li);
    }
  }
  dividedDifferences(sc.xs, 0, sc.cs, 0, q);
  newtonTerms(sc.xs, 0, sc.cs, 0, q, m + 1, p);
  sc.r[c] = newtonOut.value;
  sc.e[c] = newtonOut.last;
  sc.cols[c] = j;
  sc.colOff[c] = off;
  sc.vFrom[c] = lo;
  sc.vTo[c] = hi;
  if (
    zone &&
    plan.method === "newton" &&
    m >= 2 &&
    p >= br.x[off + lo]! &&
    p <= br.x[off + hi]!
  ) {
    // step-one overshoot: the zone's values rise or fall steadily and the value leaves their range (only
    // between the zone's nodes: beyond them, continuing a steady rise is expected, not an overshoot)
    let up = true;
    let down = true;
    let min = Infinity;
    let max = -Infinity;
    for (let li = lo; li <= hi; li++) {
      const y = br.y[off + li]!;
      min = Math.min(min, y);
      max = Math.max(max, y);
      if (li > lo) {
        const prev = br.y[off + li - 1]!;
        if (y < prev) up = false;
        if (y > prev) down = false;
      }
    }
    const tol = overshootTolerance(min, max);
    const r = sc.r[c]!;
    if ((up || down) && (r < min - tol || r > max + tol)) flags |= W_OVERSHOOT;
  }
  return flags;
}

/** Step-two overshoot on the zone part of the new row (r in Newton order, x its temperatures), at t. */
function rowOvershoot(
  r: Float64Array,
  x: Float64Array,
  v: number,
  t: number,
  value: number,
): boolean {
  let xMin = Infinity;
  let xMax = -Infinity;
  for (let c = 0; c < v; c++) {
    xMin = Math.min(xMin, x[c]!);
    xMax = Math.max(xMax, x[c]!);
  }
  if (t < xMin || t > xMax) return false;
  let min = Infinity;
  let max = -Infinity;
  let up = true;
  let down = true;
  // visit the zone in ascending temperature without sorting: repeatedly take the next larger x
  let prevX = -Infinity;
  let prevY = NaN;
  for (let step = 0; step < v; step++) {
    let best = -1;
    for (let c = 0; c < v; c++)
      if (x[c]! > prevX && (best < 0 || x[c]! < x[best]!)) best = c;
    const y = r[best]!;
    min = Math.min(min, y);
    max = Math.max(max, y);
    if (step > 0) {
      if (y < prevY) up = false;
      if (y > prevY) down = false;
    }
    prevX = x[best]!;
    prevY = y;
  }
  const tol = overshootTolerance(min, max);
  return (up || down) && (value < min - tol || value > max + tol);
}

/**
 * Bubble-point pressure at temperature t, interpolated along temperature through every column's bubble
 * point with the method's own temperature step (Newton on the zone, pchip, or linear).
 */
function bubblePointAt(plan: Plan, t: number): number {
  const prep = plan.prep;
  const { M, T } = prep;
  const pb = prep.bubble!.pb;
  if (M === 1) return pb[0]!;
  const k = prep.tAxis.cell(t);
  if (plan.method === "pchip") {
    pchipCell(T, 0, pb, 0, M, k, t);
    return pchipOut.value;
  }
  const n = Math.min(plan.n, M - 1);
  const s = zoneStart(T, 0, M, t, n, k);
  const sc = plan.scratch;
  for (let i = 0; i <= n; i++) {
    sc.xs[i] = T[s + i]!;
    sc.cs[i] = pb[s + i]!;
  }
  dividedDifferences(sc.xs, 0, sc.cs, 0, n + 1);
  newtonTerms(sc.xs, 0, sc.cs, 0, n + 1, n + 1, t);
  return newtonOut.value;
}

/**
 * Would the zone rule, applied as if every cell had been measured, have used a cell that was not? Then the
 * zone was moved or shrunk because of missing data.
 */
function idealZoneHasGap(
  plan: Plan,
  br: BranchNodes,
  p: number,
  t: number,
): boolean {
  const sc = plan.scratch;
  const { M, T } = plan.prep;
  let ni = 0;
  for (let j = 0; j < M; j++) {
    if (br.fullOff[j + 1]! > br.fullOff[j]!) {
      sc.idealX[ni] = T[j]!;
      sc.idealCol[ni] = j;
      ni++;
    }
  }
  if (ni === 0) return true;
  const kT = cellOf(sc.idealX, 0, ni, t);
  let cFrom: number;
  let cTo: number;
  const isNewton = plan.method !== "pchip";
  if (isNewton) {
    const n = Math.min(plan.n, ni - 1);
    cFrom = zoneStart(sc.idealX, 0, ni, t, n, kT);
    cTo = cFrom + n;
  } else {
    cFrom = ni < 2 ? 0 : Math.max(0, kT - 1);
    cTo = ni < 2 ? 0 : Math.min(ni - 1, kT + 2);
  }
  for (let c = cFrom; c <= cTo; c++) {
    const j = sc.idealCol[c]!;
    const fo = br.fullOff[j]!;
    const fc = br.fullOff[j + 1]! - fo;
    const k = cellOf(br.fullX, fo, fc, p);
    let from: number;
    let to: number;
    if (isNewton) {
      const m = Math.min(plan.m, fc - 1);
      from = zoneStart(br.fullX, fo, fc, p, m, k);
      to = from + m;
    } else {
      from = fc < 2 ? 0 : Math.max(0, k - 1);
      to = fc < 2 ? 0 : Math.min(fc - 1, k + 2);
    }
    for (let i = from; i <= to; i++)
      if (Number.isNaN(br.fullY[fo + i]!)) return true;
  }
  return false;
}

function writeStencilSpan(
  plan: Plan,
  br: BranchNodes,
  out: BatchResult,
  o: number,
): void {
  const sc = plan.scratch;
  let rLo = Infinity;
  let rHi = -Infinity;
  let cLo = Infinity;
  let cHi = -Infinity;
  for (let c = 0; c < sc.nCols; c++) {
    const j = sc.cols[c]!;
    cLo = Math.min(cLo, j);
    cHi = Math.max(cHi, j);
    const off = sc.colOff[c]!;
    for (let li = sc.vFrom[c]!; li <= sc.vTo[c]!; li++) {
      const row = br.row[off + li]!;
      if (row >= 0) {
        rLo = Math.min(rLo, row);
        rHi = Math.max(rHi, row);
      }
    }
  }
  out.pressureStart[o] = rHi >= rLo ? rLo : 0;
  out.pressureCount[o] = rHi >= rLo ? rHi - rLo + 1 : 0;
  out.temperatureStart[o] = cLo;
  out.temperatureCount[o] = cHi - cLo + 1;
}

/**
 * Grid rows and columns whose measured values make up the last result, and the exact cells column by
 * column (for `Result.stencil`).
 */
export function stencilLists(plan: Plan): Stencil {
  const sc = plan.scratch;
  const br = plan.prep.branches[sc.branch]!;
  const rows = new Set<number>();
  const columns: StencilColumn[] = [];
  for (let c = 0; c < sc.nCols; c++) {
    const off = sc.colOff[c]!;
    const pressure: number[] = [];
    let bubble = false;
    for (let li = sc.vFrom[c]!; li <= sc.vTo[c]!; li++) {
      const row = br.row[off + li]!;
      if (row >= 0) {
        rows.add(row);
        pressure.push(row);
      } else bubble = true;
    }
    pressure.sort((a, b) => a - b);
    const column: StencilColumn = { temperature: sc.cols[c]!, pressure };
    if (bubble) column.bubblePointNode = true;
    columns.push(column);
  }
  columns.sort((a, b) => a.temperature - b.temperature);
  return {
    pressure: [...rows].sort((a, b) => a - b),
    temperature: columns.map((c) => c.temperature),
    columns,
  };
}

function traceNewtonColumn(
  plan: Plan,
  br: BranchNodes,
  j: number,
  c: number,
  zone: boolean,
  status: number,
): TraceStep {
  const sc = plan.scratch;
  const off = br.off[j]!;
  const cnt = br.off[j + 1]! - off;
  const m = Math.min(plan.m, cnt - 1);
  const q = cnt === 1 ? 1 : Math.min(m + 2, cnt);
  const nodes: TraceNode[] = [];
  for (let i = 0; i < q; i++) {
    const li = sc.pOrd[c * STRIDE + i]!;
    const row = br.row[off + li]!;
    nodes.push({
      coordinate: br.x[off + li]!,
      value: br.y[off + li]!,
      index: row >= 0 ? row : null,
      role: i <= m ? "zone" : "error-check",
    });
  }
  return {
    column: j,
    role: zone ? "zone" : "error-check",
    status: STATUS[status]!,
    nodes,
    value: sc.r[c]!,
    correction: sc.e[c]!,
  };
}

function tracePchip(
  x: Float64Array,
  y: Float64Array,
  rows: Int32Array,
  off: number,
  cnt: number,
  k: number,
  column: number,
  status: number,
): TraceStep {
  const from = cnt < 2 ? 0 : Math.max(0, k - 1);
  const to = cnt < 2 ? 0 : Math.min(cnt - 1, k + 2);
  const nodes: TraceNode[] = [];
  for (let li = from; li <= to; li++) {
    const row = rows[off + li]!;
    nodes.push({
      coordinate: x[off + li]!,
      value: y[off + li]!,
      index: row >= 0 ? row : null,
      role: "zone",
    });
  }
  const step: TraceStep = {
    column,
    role: "zone",
    status: STATUS[status]!,
    nodes,
    value: pchipOut.value,
    correction: pchipOut.estimate,
  };
  if (cnt >= 2) {
    step.pchip = {
      cell: [x[off + k]!, x[off + k + 1]!],
      derivatives: [pchipOut.d0, pchipOut.d1],
      threePointDerivatives: [pchipOut.b0, pchipOut.b1],
    };
  }
  return step;
}

const BRANCH_TEXT = [
  "",
  " on the saturated branch (at or below the bubble point)",
  " on the undersaturated branch (above the bubble point)",
];

function noValidZone(
  prep: PreparedGrid,
  br: BranchNodes,
  b: number,
  p: number,
  t: number,
  nu: number,
  ux: Float64Array,
  pointIndex: number,
): InterpolationError {
  const parts: string[] = [];
  for (let j = 0; j < prep.M; j++) {
    const off = br.off[j]!;
    const cnt = br.off[j + 1]! - off;
    const temp = formatInMessage(prep.T[j]!);
    parts.push(
      cnt === 0
        ? `at ${temp}: none`
        : `at ${temp}: ${formatInMessage(br.x[off]!)} to ${formatInMessage(br.x[off + cnt - 1]!)}`,
    );
  }
  const reason =
    nu === 0
      ? `no temperature column has measured values${BRANCH_TEXT[b]} around pressure ${formatInMessage(p)}`
      : `only the columns from temperature ${formatInMessage(ux[0]!)} to ${formatInMessage(ux[nu - 1]!)} have measured values${BRANCH_TEXT[b]} around pressure ${formatInMessage(p)}, and the temperature ${formatInMessage(t)} is outside them`;
  const prefix = pointIndex < 0 ? "" : `Point ${pointIndex}: `;
  return new InterpolationError(
    "no-valid-zone",
    `${prefix}No measured values surround pressure ${formatInMessage(p)} and temperature ${formatInMessage(t)}: ${reason}. Measured pressure ranges per temperature${BRANCH_TEXT[b]}: ${parts.join("; ")}.${prep.complete ? "" : " Cells that were not measured (null) cannot be used."}${b === 0 ? "" : " A column's values on the other side of its bubble point are never used."} Pass extrapolate: true to extrapolate from the nearest measured values.`,
    {
      pressure: p,
      temperature: t,
      pointIndex: pointIndex < 0 ? undefined : pointIndex,
      branch: ["none", "saturated", "undersaturated"][b],
    },
  );
}
