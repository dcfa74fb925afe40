// Dispatch between the fast kernels (complete grid, no bubble points) and the general evaluator, and the
// conversion of one evaluated point into a `Result`.
import { describeBadNumber, InterpolationError } from "./errors";
import { evaluateGeneral, stencilLists } from "./general";
import { runNewtonFast, runPchipFast } from "./kernels";
import type { Plan } from "./plan";
import type { BatchResult, Point, Result, Stencil } from "./types";
import { W_OVERSHOOT, warningsFromFlags } from "./warnings";

/** Evaluates points [from, to) of ps/ts into `out` from index outOffset. */
export function evaluateRange(
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
  if (plan.newton) runNewtonFast(plan, ps, ts, from, to, extrapolate, out, outOffset, batch);
  else if (plan.pchip) runPchipFast(plan, ps, ts, from, to, extrapolate, out, outOffset, batch);
  else {
    for (let idx = from; idx < to; idx++) {
      evaluateGeneral(plan, ps[idx]!, ts[idx]!, extrapolate, out, outOffset + idx - from, batch ? idx : -1, null);
    }
  }
}

export function checkPoint(point: Point, pointIndex: number): void {
  const prefix = pointIndex < 0 ? "The point" : `Point ${pointIndex}`;
  if (typeof point !== "object" || point === null) {
    throw new InterpolationError("invalid-point", `${prefix} must be an object { pressure, temperature }; got ${describeBadNumber(point)}.`, {
      pointIndex: pointIndex < 0 ? undefined : pointIndex,
    });
  }
  for (const axis of ["pressure", "temperature"] as const) {
    const v: unknown = point[axis];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new InterpolationError("invalid-point", `${prefix} has ${axis} ${describeBadNumber(v)}; a finite number is needed.`, {
        axis,
        pointIndex: pointIndex < 0 ? undefined : pointIndex,
      });
    }
  }
}

/** Evaluates one point into plan.single and returns it as a Result. */
export function evaluatePoint(plan: Plan, point: Point, extrapolate: boolean, pointIndex: number): Result {
  checkPoint(point, pointIndex);
  plan.singleP[0] = point.pressure;
  plan.singleT[0] = point.temperature;
  evaluateRange(plan, plan.singleP, plan.singleT, 0, 1, extrapolate, plan.single, 0, false);
  return toResult(plan);
}

function span(start: number, count: number): number[] {
  const out: number[] = new Array<number>(count);
  for (let i = 0; i < count; i++) out[i] = start + i;
  return out;
}

/** The Result for the point last evaluated into plan.single. */
export function toResult(plan: Plan): Result {
  const buf = plan.single;
  const flags = buf.warnings[0]!;
  const stencil: Stencil =
    plan.newton || plan.pchip
      ? {
          pressure: span(buf.pressureStart[0]!, buf.pressureCount[0]!),
          temperature: span(buf.temperatureStart[0]!, buf.temperatureCount[0]!),
        }
      : stencilLists(plan);
  const result: Result = {
    value: buf.values[0]!,
    errorEstimate: buf.errorEstimates[0]!,
    stencil,
    warnings: flags === 0 ? [] : warningsFromFlags(flags),
  };
  if (plan.prep.bubble && buf.branches) {
    result.branch = buf.branches[0] === 1 ? "saturated" : "undersaturated";
    result.bubblePointPressure = plan.scratch.pbStar;
  }
  if (flags & W_OVERSHOOT && plan.pchipPlan) {
    result.alternative = {
      method: "pchip",
      value: buf.alternatives[0]!,
      errorEstimate: plan.pchipPlan.single.errorEstimates[0]!,
    };
  }
  return result;
}
