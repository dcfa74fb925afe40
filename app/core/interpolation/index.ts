// Interpolation engine for measured pressure–temperature property tables. Pure TypeScript: no framework,
// no I/O. See README.md in this folder for the methods, the zone rule, the error estimate and warnings.
import { InterpolationError } from "./errors";
import { evaluatePoint, evaluateRange } from "./evaluate";
import { allocateBatch, getPlan } from "./plan";
import { prepareGrid } from "./prepare";
import type { BatchResult, Grid, Options, Point, PointColumns, Result } from "./types";
import { normalizeOptions } from "./validate";

export type { Branch, BatchResult, Grid, Method, Options, Point, PointColumns, Result, Stencil } from "./types";
export { InterpolationError } from "./errors";
export type { InterpolationErrorCode } from "./errors";
export { describeWarning, WARNING_CODES, WARNING_FLAGS, warningsFromFlags } from "./warnings";
export type { Warning } from "./warnings";
export { DEFAULT_DEGREE, MAX_DEGREE } from "./validate";
export { explainInterpolation } from "./explain";
export type { Explanation, ExplanationNode, ExplanationStep } from "./explain";

/** Interpolates one point. Throws InterpolationError for bad input or a point it cannot serve. */
export function interpolateGrid(grid: Grid, point: Point, options: Options): Result {
  const opts = normalizeOptions(options);
  const plan = getPlan(prepareGrid(grid), opts.method, opts.m, opts.n);
  return evaluatePoint(plan, point, opts.extrapolate, -1);
}

/**
 * Interpolates many points. An array of points gives an array of Results. Two typed arrays
 * { pressures, temperatures } give a BatchResult of typed arrays, computed without allocating per point
 * (the form for plot surfaces and the API). A point that cannot be served throws, naming its index.
 */
export function interpolateGridMany(grid: Grid, points: readonly Point[], options: Options): Result[];
export function interpolateGridMany(grid: Grid, points: PointColumns, options: Options): BatchResult;
export function interpolateGridMany(
  grid: Grid,
  points: readonly Point[] | PointColumns,
  options: Options,
): Result[] | BatchResult {
  const opts = normalizeOptions(options);
  const prep = prepareGrid(grid);
  const plan = getPlan(prep, opts.method, opts.m, opts.n);
  if (Array.isArray(points)) {
    const list: readonly Point[] = points;
    return list.map((point, i) => evaluatePoint(plan, point, opts.extrapolate, i));
  }
  const columns = points as PointColumns;
  if (
    typeof columns !== "object" ||
    columns === null ||
    !(columns.pressures instanceof Float64Array) ||
    !(columns.temperatures instanceof Float64Array)
  ) {
    throw new InterpolationError(
      "invalid-point",
      "Points must be an array of { pressure, temperature } or { pressures: Float64Array, temperatures: Float64Array }.",
    );
  }
  const { pressures, temperatures } = columns;
  if (pressures.length !== temperatures.length) {
    throw new InterpolationError(
      "invalid-point",
      `pressures has ${pressures.length} entries but temperatures has ${temperatures.length}; they must pair up.`,
    );
  }
  const out = allocateBatch(pressures.length, prep.bubble !== null);
  evaluateRange(plan, pressures, temperatures, 0, pressures.length, opts.extrapolate, out, 0, true);
  return out;
}
