import type { Warning } from "./warnings";

export type Method = "linear" | "newton" | "pchip";

/**
 * A measured property table on a pressure–temperature grid. Units are whatever the table is in; the engine
 * never converts.
 */
export type Grid = {
  /** Strictly increasing. */
  pressures: number[];
  /** Strictly increasing; a single temperature makes the grid a 1-D table in pressure. */
  temperatures: number[];
  /** values[i][j] at pressures[i], temperatures[j]; null = not measured. */
  values: (number | null)[][];
  /** Optional saturation (bubble-point) pressure per temperature column; null = not known for that column. */
  bubblePoints?: (number | null)[];
};

export type Point = { pressure: number; temperature: number };

export type Options = {
  method: Method;
  /**
   * Polynomial degree for `newton`: one number for both axes, or [pressure, temperature]. Default 3 (a 4×4
   * zone). Ignored by `linear` (always 1) and `pchip`, but still checked.
   */
  degree?: number | [number, number];
  /** Allow points outside the measured range; the result then carries the `extrapolated` warning. */
  extrapolate?: boolean;
  /**
   * With `extrapolate`: the farthest a point may lie outside the measured range, per axis, as a fraction
   * of that axis' measured span (default 0.25; Infinity = no limit). Farther points are refused with
   * `extrapolation-too-far`. An axis with a single node has no span: only the other axis is limited.
   */
  maxExtrapolation?: number;
};

/**
 * Grid indices of the measured nodes whose values make up the result (see README, "Stencil"):
 * `pressure` every grid row used by some column, `temperature` every grid column used, and `columns` the
 * exact cells, column by column (ascending temperature index): with missing cells or bubble points a
 * column may use its own rows. Every listed cell (pressure[i], temperature j) was measured. A column whose
 * zone includes an inserted bubble-point node (pb between two grid rows: not a grid cell) says so with
 * `bubblePointNode: true`. Arrays may be shared between the fields of one result: treat them as read-only.
 */
export type Stencil = {
  pressure: number[];
  temperature: number[];
  columns: StencilColumn[];
};

export type StencilColumn = {
  /** Grid column index. */
  temperature: number;
  /** Grid row indices of the measured cells of this column that were used, ascending. */
  pressure: number[];
  /** Present when this column also used its bubble-point node inserted between grid rows. */
  bubblePointNode?: true;
};

export type Branch = "saturated" | "undersaturated";

export type Result = {
  value: number;
  /** ≥ 0; NaN only with the `estimate-unavailable` warning (the table says nothing that way). README "Error estimate". */
  errorEstimate: number;
  stencil: Stencil;
  warnings: Warning[];
  /** Present when the grid has bubble points: the branch the point lies on. */
  branch?: Branch;
  /** Present when the grid has bubble points: the bubble-point pressure at the point's temperature. */
  bubblePointPressure?: number;
  /** Present with the `overshoot` warning: the shape-preserving value for the same point. */
  alternative?: { method: "pchip"; value: number; errorEstimate: number };
};

/** Many points as two typed arrays of equal length (the allocation-free batch form). */
export type PointColumns = {
  pressures: Float64Array;
  temperatures: Float64Array;
};

/**
 * Result of `interpolateGridMany` for typed-array input: one entry per point in each array.
 *
 * - `values`, `errorEstimates`: as `Result.value` / `Result.errorEstimate`.
 * - `warnings`: bitmask per point; bits in WARNING_FLAGS, expand with `warningsFromFlags`.
 * - `alternatives`: null when no point has the `overshoot` warning; otherwise the pchip value where the
 *   `overshoot` bit is set and a copy of `values` elsewhere.
 * - `pressureStart`/`pressureCount`, `temperatureStart`/`temperatureCount`: the first grid index and the
 *   span (last − first + 1) of the stencil along each axis. On a complete grid without bubble points this
 *   is exactly the zone of the zone rule. With missing cells or bubble points a column may use its own
 *   nodes inside that span; ask `interpolateGrid` for the exact list of one point.
 * - `branches`: with bubble points, 1 = saturated, 2 = undersaturated per point; otherwise null.
 * - `refusals`: null when every point was served; otherwise per point 0 = served, k = the code
 *   REFUSAL_CODES[k − 1] ("out-of-range", "no-valid-zone", "extrapolation-too-far"). A refused point has
 *   value and error estimate NaN, no warnings, a stencil of count 0 and (with bubble points) the branch it
 *   was on when the refusal concerns a branch, else 0.
 */
export type BatchResult = {
  count: number;
  values: Float64Array;
  errorEstimates: Float64Array;
  warnings: Uint16Array;
  alternatives: Float64Array | null;
  pressureStart: Int32Array;
  pressureCount: Uint8Array;
  temperatureStart: Int32Array;
  temperatureCount: Uint8Array;
  branches: Uint8Array | null;
  refusals: Uint8Array | null;
};
