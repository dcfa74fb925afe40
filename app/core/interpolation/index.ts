// Interpolation engine for measured pressure–temperature property tables. Pure TypeScript: no framework,
// no I/O. See README.md in this folder for the methods, the zone rule, the error estimate and warnings.
import { InterpolationError } from "./errors";
import { evaluatePoint, evaluateRange } from "./evaluate";
import { allocateBatch, getPlan } from "./plan";
import { prepareGrid } from "./prepare";
import type {
  BatchResult,
  Grid,
  Options,
  Point,
  PointColumns,
  Result,
} from "./types";
import type { NormalizedOptions } from "./validate";
import { normalizeOptions } from "./validate";

const scratchOptions: NormalizedOptions = {
  method: "linear",
  m: 1,
  n: 1,
  extrapolate: false,
  reach: 0,
};

export type {
  Branch,
  BatchResult,
  Grid,
  Method,
  Options,
  Point,
  PointColumns,
  Result,
  Stencil,
  StencilColumn,
} from "./types";
export { InterpolationError } from "./errors";
export type { InterpolationErrorCode } from "./errors";
export {
  describeWarning,
  WARNING_CODES,
  WARNING_FLAGS,
  warningsFromFlags,
} from "./warnings";
export type { Warning } from "./warnings";
export { DEFAULT_DEGREE, MAX_DEGREE } from "./validate";
export {
  DEFAULT_MAX_EXTRAPOLATION,
  REFUSAL_CODES,
  SNAP_RELATIVE,
} from "./range";
export type { RefusalCode } from "./range";
export { explainInterpolation } from "./explain";
export type { Explanation, ExplanationNode, ExplanationStep } from "./explain";

/** Interpolates one point. Throws InterpolationError for bad input or a point it cannot serve. */
export function interpolateGrid(
  grid: Grid,
  point: Point,
  options: Options,
): Result {
  const opts = normalizeOptions(options, scratchOptions);
  const plan = getPlan(prepareGrid(grid), opts.method, opts.m, opts.n);
  return evaluatePoint(plan, point, opts.reach, -1);
}

/**
 * Interpolates many points. An array of points gives an array of Results. Two typed arrays
 * { pressures, temperatures } give a BatchResult of typed arrays, computed without allocating per point
 * (the form for plot surfaces and the API). A point that cannot be served throws, naming its index.
 *
 * `reuse`: a BatchResult from an earlier call with the same number of points (on a grid with bubble
 * points if and only if this one has them); its arrays are overwritten and returned instead of new ones,
 * so a plot redrawn many times allocates nothing at all.
 */
export function interpolateGridMany(
  grid: Grid,
  points: readonly Point[],
  options: Options,
): Result[];
export function interpolateGridMany(
  grid: Grid,
  points: PointColumns,
  options: Options,
  reuse?: BatchResult,
): BatchResult;
export function interpolateGridMany(
  grid: Grid,
  points: readonly Point[] | PointColumns,
  options: Options,
  reuse?: BatchResult,
): Result[] | BatchResult {
  const opts = normalizeOptions(options);
  const prep = prepareGrid(grid);
  const plan = getPlan(prep, opts.method, opts.m, opts.n);
  if (Array.isArray(points)) {
    const list: readonly Point[] = points;
    return list.map((point, i) => {
      try {
        return evaluatePoint(plan, point, opts.reach, i);
      } catch (e) {
        // name the point in errors raised without its index (range, missing data)
        if (
          e instanceof InterpolationError &&
          e.details.pointIndex === undefined
        ) {
          throw new InterpolationError(e.code, `Point ${i}: ${e.message}`, {
            ...e.details,
            pointIndex: i,
          });
        }
        throw e;
      }
    });
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
  let out: BatchResult;
  if (reuse === undefined)
    out = allocateBatch(pressures.length, prep.bubble !== null);
  else {
    if (
      reuse.count !== pressures.length ||
      reuse.values.length !== reuse.count ||
      (reuse.branches !== null) !== (prep.bubble !== null)
    ) {
      throw new InterpolationError(
        "invalid-options",
        `The result to reuse was made for ${reuse.count} points${reuse.branches ? " on a grid with bubble points" : ""}; this call has ${pressures.length} points${prep.bubble ? " on a grid with bubble points" : ""}.`,
      );
    }
    out = reuse;
    out.alternatives = null;
    out.refusals = null;
  }
  evaluateRange(
    plan,
    pressures,
    temperatures,
    0,
    pressures.length,
    opts.reach,
    out,
    0,
    true,
  );
  return out;
}
