import { formatInMessage } from "../format";
import { InterpolationError } from "./errors";
import type { PreparedGrid } from "./prepare";
import { W_EXTRAPOLATED } from "./warnings";

function where(pointIndex: number, p: number, t: number): string {
  return pointIndex < 0
    ? ""
    : `Point ${pointIndex} (pressure ${formatInMessage(p)}, temperature ${formatInMessage(t)}): `;
}

/**
 * Checks a point against the measured range. Returns W_EXTRAPOLATED when it lies outside and
 * extrapolation is allowed, 0 when inside; throws otherwise. pointIndex < 0 for a single point.
 */
export function checkRange(
  prep: PreparedGrid,
  p: number,
  t: number,
  extrapolate: boolean,
  pointIndex: number,
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
  if (p < P[0]! || p > P[N - 1]!) {
    if (!extrapolate) throw outOfRange("pressure", p, P, N, pointIndex, p, t);
    flags = W_EXTRAPOLATED;
  }
  if (t < T[0]! || t > T[M - 1]!) {
    if (!extrapolate)
      throw outOfRange("temperature", t, T, M, pointIndex, p, t);
    flags = W_EXTRAPOLATED;
  }
  return flags;
}

function outOfRange(
  axis: "pressure" | "temperature",
  value: number,
  nodes: Float64Array,
  n: number,
  pointIndex: number,
  p: number,
  t: number,
): InterpolationError {
  const lo = nodes[0]!;
  const hi = nodes[n - 1]!;
  const side = value < lo ? "below" : "above";
  const text =
    n === 1
      ? `The table was measured at a single ${axis}, ${formatInMessage(lo)}; the ${axis} ${formatInMessage(value)} differs from it.`
      : `The measured ${axis}s run from ${formatInMessage(lo)} to ${formatInMessage(hi)}; the ${axis} ${formatInMessage(value)} is ${side} that range.`;
  return new InterpolationError(
    "out-of-range",
    `${where(pointIndex, p, t)}${text} Pass extrapolate: true to extrapolate; the result is then marked 'extrapolated'.`,
    {
      axis,
      value,
      min: lo,
      max: hi,
      pointIndex: pointIndex < 0 ? undefined : pointIndex,
    },
  );
}
