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
};

/** Grid indices of the measured nodes whose values make up the result (see README, "Stencil"). */
export type Stencil = { pressure: number[]; temperature: number[] };

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
};
