import { formatApart } from "../format/distinct";
import { formatInMessage } from "../format";
import { InterpolationError } from "./errors";
import type { PreparedGrid } from "./prepare";
import { W_EXTRAPOLATED } from "./warnings";

/**
 * Codes of `BatchResult.refusals`: 0 = served, k = REFUSAL_CODES[k − 1]. The same codes as the
 * InterpolationError the single-point form throws for that point.
 */
export const REFUSAL_CODES = [
  "out-of-range",
  "no-valid-zone",
  "extrapolation-too-far",
] as const;

export type RefusalCode = (typeof REFUSAL_CODES)[number];

export const R_OUT_OF_RANGE = 1;
export const R_NO_VALID_ZONE = 2;
export const R_TOO_FAR = 3;

/** Default `maxExtrapolation`: a quarter of the measured span of the axis. */
export const DEFAULT_MAX_EXTRAPOLATION = 0.25;

/**
 * Relative tolerance under which a coordinate is taken to be an axis node (see README, "Snapping"): far
 * above the round-off of converting units (bara → psia, °C → °F: a few 1e-16 relative), far below any
 * difference a laboratory reports.
 */
export const SNAP_RELATIVE = 1e-9;

/**
 * How close to a node of this axis a coordinate must be to be that node: SNAP_RELATIVE of the axis span
 * (of the node's magnitude, at least 1, for a one-node axis) plus 8 machine epsilons of the largest end.
 */
export function snapTolerance(nodes: Float64Array): number {
  const n = nodes.length;
  const lo = nodes[0]!;
  const hi = nodes[n - 1]!;
  const span = hi - lo;
  const size = Math.max(Math.abs(lo), Math.abs(hi));
  return (
    SNAP_RELATIVE * (span > 0 ? span : Math.max(1, size)) +
    8 * Number.EPSILON * size
  );
}

/** The snapped coordinates of the last point checked by `checkRange` (written only when it was outside). */
export const snapped = { p: 0, t: 0 };

function where(pointIndex: number, p: number, t: number): string {
  return pointIndex < 0
    ? ""
    : `Point ${pointIndex} (pressure ${formatInMessage(p)}, temperature ${formatInMessage(t)}): `;
}

/**
 * Checks a point against the measured range. A coordinate within the snap tolerance of an axis end is
 * that end (written to `snapped`, with the other coordinate). Returns W_EXTRAPOLATED when the point lies
 * outside and extrapolation is allowed and near enough, 0 when inside. Otherwise throws, or, with
 * `refuse` (the typed batch path), returns −(refusal code) instead. pointIndex < 0 for a single point.
 *
 * `reach`: 0 = no extrapolation; otherwise the largest distance outside the range, as a fraction of the
 * axis span (an axis with a single node has no span and no limit: the other axis decides).
 */
export function checkRange(
  prep: PreparedGrid,
  p: number,
  t: number,
  reach: number,
  pointIndex: number,
  refuse = false,
): number {
  if (!Number.isFinite(p) || !Number.isFinite(t)) {
    const axis = Number.isFinite(p) ? "temperature" : "pressure";
    const bad = axis === "pressure" ? p : t;
    throw new InterpolationError(
      "invalid-point",
      `${where(pointIndex, p, t)}The ${axis} is ${formatInMessage(bad)}; a point needs finite numbers.`,
      { axis, value: bad, pointIndex: pointIndex < 0 ? undefined : pointIndex },
    );
  }
  const { P, T, N, M } = prep;
  let flags = 0;
  let sp = p;
  let st = t;
  const pLo = P[0]!;
  const pHi = P[N - 1]!;
  const tLo = T[0]!;
  const tHi = T[M - 1]!;
  if (p < pLo || p > pHi) {
    const tol = prep.pSnap;
    if (p < pLo && pLo - p <= tol) sp = pLo;
    else if (p > pHi && p - pHi <= tol) sp = pHi;
    else {
      const code = beyond(pHi - pLo, p < pLo ? pLo - p : p - pHi, reach);
      if (code !== 0) {
        if (refuse) return -code;
        throw outOfRange(code, "pressure", p, P, N, reach, pointIndex, p, t);
      }
      flags = W_EXTRAPOLATED;
    }
  }
  if (t < tLo || t > tHi) {
    const tol = prep.tSnap;
    if (t < tLo && tLo - t <= tol) st = tLo;
    else if (t > tHi && t - tHi <= tol) st = tHi;
    else {
      const code = beyond(tHi - tLo, t < tLo ? tLo - t : t - tHi, reach);
      if (code !== 0) {
        if (refuse) return -code;
        throw outOfRange(code, "temperature", t, T, M, reach, pointIndex, p, t);
      }
      flags = W_EXTRAPOLATED;
    }
  }
  snapped.p = sp;
  snapped.t = st;
  return flags;
}

/** 0 when a point `distance` outside an axis of this span may be extrapolated, else the refusal code. */
function beyond(span: number, distance: number, reach: number): number {
  if (reach <= 0) return R_OUT_OF_RANGE;
  return span > 0 && distance > reach * span ? R_TOO_FAR : 0;
}

function outOfRange(
  code: number,
  axis: "pressure" | "temperature",
  value: number,
  nodes: Float64Array,
  n: number,
  reach: number,
  pointIndex: number,
  p: number,
  t: number,
): InterpolationError {
  const lo = nodes[0]!;
  const hi = nodes[n - 1]!;
  const side = value < lo ? "below" : "above";
  const v = formatApart(value, [lo, hi], 10);
  const details = {
    axis,
    value,
    min: lo,
    max: hi,
    pointIndex: pointIndex < 0 ? undefined : pointIndex,
  };
  if (code === R_TOO_FAR) {
    const limit = reach * (hi - lo);
    const distance = value < lo ? lo - value : value - hi;
    return new InterpolationError(
      "extrapolation-too-far",
      `${where(pointIndex, p, t)}The measured ${axis}s run from ${formatInMessage(lo)} to ${formatInMessage(hi)}; the ${axis} ${v} is ${formatApart(distance, [limit], 10)} ${side} that range, farther than the extrapolation limit of ${formatApart(limit, [distance], 10)} (maxExtrapolation ${formatInMessage(reach)} of the span).`,
      { ...details, maxExtrapolation: reach, limit },
    );
  }
  const text =
    n === 1
      ? `The table was measured at a single ${axis}, ${formatInMessage(lo)}; the ${axis} ${v} differs from it.`
      : `The measured ${axis}s run from ${formatInMessage(lo)} to ${formatInMessage(hi)}; the ${axis} ${v} is ${side} that range.`;
  return new InterpolationError(
    "out-of-range",
    `${where(pointIndex, p, t)}${text} Pass extrapolate: true to extrapolate; the result is then marked 'extrapolated'.`,
    details,
  );
}
