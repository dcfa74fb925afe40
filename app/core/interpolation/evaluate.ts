// Dispatch between the fast kernels (complete grid, no bubble points) and the general evaluator, and the
// conversion of one evaluated point into a `Result`.
import { describeBadNumber, InterpolationError } from "./errors";
import { evaluateGeneral, stencilLists } from "./general";
import { fastKernel } from "./kernels";
import type { Plan } from "./plan";
import { finishAlternatives } from "./plan";
import type {
  BatchResult,
  Point,
  Result,
  Stencil,
  StencilColumn,
} from "./types";
import { W_OVERSHOOT, warningsFromFlags } from "./warnings";

/** Evaluates points [from, to) of ps/ts into `out` from index outOffset. */
export function evaluateRange(
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
  let kernel = plan.kernel;
  if (kernel === undefined) kernel = plan.kernel = fastKernel(plan);
  if (kernel) {
    kernel(plan, ps, ts, from, to, reach, out, outOffset, batch);
    const tb = plan.newton;
    if (tb) {
      // zone sizes are the same for every point on a complete grid
      if (to - from === 1) {
        out.pressureCount[outOffset] = tb.p.valueTerms;
        out.temperatureCount[outOffset] = tb.t.valueTerms;
      } else {
        out.pressureCount.fill(
          tb.p.valueTerms,
          outOffset,
          outOffset + to - from,
        );
        out.temperatureCount.fill(
          tb.t.valueTerms,
          outOffset,
          outOffset + to - from,
        );
      }
      const refused = out.refusals;
      if (refused) {
        for (let o = outOffset; o < outOffset + to - from; o++)
          if (refused[o] !== 0) {
            out.pressureCount[o] = 0;
            out.temperatureCount[o] = 0;
          }
      }
    }
  } else {
    for (let idx = from; idx < to; idx++) {
      evaluateGeneral(
        plan,
        ps[idx]!,
        ts[idx]!,
        reach,
        out,
        outOffset + idx - from,
        batch ? idx : -1,
        null,
      );
    }
  }
  finishAlternatives(out, outOffset, outOffset + to - from);
}

export function checkPoint(point: Point, pointIndex: number): void {
  if (typeof point !== "object" || point === null)
    throw badPoint(point, "", pointIndex);
  const p: unknown = point.pressure;
  const t: unknown = point.temperature;
  if (typeof p !== "number" || !Number.isFinite(p))
    throw badPoint(p, "pressure", pointIndex);
  if (typeof t !== "number" || !Number.isFinite(t))
    throw badPoint(t, "temperature", pointIndex);
}

function badPoint(
  value: unknown,
  axis: "" | "pressure" | "temperature",
  pointIndex: number,
): InterpolationError {
  const prefix = pointIndex < 0 ? "The point" : `Point ${pointIndex}`;
  const details = {
    axis: axis || undefined,
    pointIndex: pointIndex < 0 ? undefined : pointIndex,
  };
  return axis === ""
    ? new InterpolationError(
        "invalid-point",
        `${prefix} must be an object { pressure, temperature }; got ${describeBadNumber(value)}.`,
        details,
      )
    : new InterpolationError(
        "invalid-point",
        `${prefix} has ${axis} ${describeBadNumber(value)}; a finite number is needed.`,
        details,
      );
}

/** Evaluates one point into plan.single and returns it as a Result. */
export function evaluatePoint(
  plan: Plan,
  point: Point,
  reach: number,
  pointIndex: number,
): Result {
  checkPoint(point, pointIndex);
  const kernel = plan.kernel;
  if (kernel && pointIndex < 0) {
    // the common case, kept short: a single point on a complete grid
    plan.singleP[0] = point.pressure;
    plan.singleT[0] = point.temperature;
    const out = plan.single;
    out.alternatives = null;
    kernel(plan, plan.singleP, plan.singleT, 0, 1, reach, out, 0, false);
    const tb = plan.newton;
    if (tb) {
      out.pressureCount[0] = tb.p.valueTerms;
      out.temperatureCount[0] = tb.t.valueTerms;
    }
    return toResult(plan);
  }
  plan.singleP[0] = point.pressure;
  plan.singleT[0] = point.temperature;
  evaluateRange(
    plan,
    plan.singleP,
    plan.singleT,
    0,
    1,
    reach,
    plan.single,
    0,
    false,
  );
  return toResult(plan);
}

/** start, start+1, …, start+count−1 (literals for the usual zone sizes: exactly sized, no growth). */
function span(start: number, count: number): number[] {
  switch (count) {
    case 1:
      return [start];
    case 2:
      return [start, start + 1];
    case 3:
      return [start, start + 1, start + 2];
    case 4:
      return [start, start + 1, start + 2, start + 3];
    default: {
      const out = new Array<number>(count);
      for (let i = 0; i < count; i++) out[i] = start + i;
      return out;
    }
  }
}

/** The Result for the point last evaluated into plan.single. */
function toResult(plan: Plan): Result {
  const buf = plan.single;
  const flags = buf.warnings[0]!;
  let stencil: Stencil;
  if (plan.kernel !== null) {
    // complete grid, no bubble points: every column of the zone uses the same rows
    const pressure = span(buf.pressureStart[0]!, buf.pressureCount[0]!);
    const temperature = span(
      buf.temperatureStart[0]!,
      buf.temperatureCount[0]!,
    );
    const columns = new Array<StencilColumn>(temperature.length);
    for (let c = 0; c < temperature.length; c++)
      columns[c] = { temperature: temperature[c]!, pressure };
    stencil = { pressure, temperature, columns };
  } else stencil = stencilLists(plan);
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
      value: buf.alternatives?.[0] ?? buf.values[0]!,
      errorEstimate: plan.pchipPlan.single.errorEstimates[0]!,
    };
  }
  return result;
}
