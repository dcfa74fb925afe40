// Tolerances shared by grid preparation, option checks and the range check (a leaf: imports nothing).

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
