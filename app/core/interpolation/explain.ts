// "How this number was obtained": the same computation as interpolateGrid, returned as plain data for
// display (zones, divided-difference tables, pchip slopes, the new row, the error estimate's parts).
import { evaluateGeneral, stencilLists } from "./general";
import type { Trace, TraceStep } from "./general";
import { dividedDifferenceTable } from "./newton";
import { getPlan } from "./plan";
import { prepareGrid } from "./prepare";
import { checkPoint } from "./evaluate";
import type { Branch, Grid, Method, Options, Point, Stencil } from "./types";
import { normalizeOptions } from "./validate";
import type { Warning } from "./warnings";
import { W_OVERSHOOT, warningsFromFlags } from "./warnings";

export type ExplanationNode = {
  /** Pressure (step one) or temperature (step two) of the node. */
  at: number;
  value: number;
  /** Grid row (step one) or grid column (step two); null for a bubble-point node between grid rows. */
  index: number | null;
  /** "error-check": the extra node used only for the error estimate. */
  role: "zone" | "error-check";
};

export type ExplanationStep = {
  axis: "pressure" | "temperature";
  /** The pressure (step one) or temperature (step two) interpolated to. */
  target: number;
  /** Step one: the grid column and its temperature. */
  column: number | null;
  temperature: number | null;
  role: "zone" | "error-check";
  /** "branch-extrapolated": continued past this column's own bubble point; "extrapolated": past its data. */
  status: "inside" | "branch-extrapolated" | "extrapolated";
  nodes: ExplanationNode[];
  /** Newton/linear: dividedDifferences[l][i] = f[x_i … x_{i+l}] over `nodes` in the order listed. */
  dividedDifferences: number[][] | null;
  /** pchip: the cell, the shape-preserving end slopes and the plain three-point slopes. */
  pchip: {
    cell: [number, number];
    derivatives: [number, number];
    threePointDerivatives: [number, number];
  } | null;
  value: number;
  /** Newton: the last Newton term; pchip: the value minus the three-point-slope cubic. */
  correction: number;
};

export type Explanation = {
  method: Method;
  point: Point;
  /** Requested [pressure, temperature] degree (newton, linear); null for pchip. */
  degree: [number, number] | null;
  branch: { side: Branch; bubblePointPressure: number } | null;
  /** Step one: one entry per temperature column used, giving the new row at the target pressure. */
  stepOne: ExplanationStep[];
  /** Step two: along temperature on the new row. */
  stepTwo: ExplanationStep;
  value: number;
  errorEstimate: number;
  /**
   * errorEstimate = growth × (factor × (pressure + temperature) + floor + rounding): the raw corrections
   * along each axis, the method's safety factor, the floor from the data's printed resolution, the
   * rounding of the arithmetic, and the growth outside the table (1 inside). NaN estimate and growth when
   * the table says nothing in a direction (`estimate-unavailable`). README "Error estimate".
   */
  errorParts: {
    pressure: number;
    temperature: number;
    factor: number;
    floor: number;
    rounding: number;
    growth: number;
  };
  warnings: Warning[];
  stencil: Stencil;
  alternative: { method: "pchip"; value: number } | null;
};

function toStep(
  step: TraceStep,
  axis: "pressure" | "temperature",
  target: number,
  temperatures: number[],
  method: Method,
): ExplanationStep {
  const nodes = step.nodes.map((n) => ({
    at: n.coordinate,
    value: n.value,
    index: n.index,
    role: n.role,
  }));
  return {
    axis,
    target,
    column: step.column >= 0 ? step.column : null,
    temperature: step.column >= 0 ? temperatures[step.column]! : null,
    role: step.role,
    status: step.status,
    nodes,
    dividedDifferences:
      method === "pchip"
        ? null
        : dividedDifferenceTable(
            nodes.map((n) => n.at),
            nodes.map((n) => n.value),
          ),
    pchip: step.pchip ?? null,
    value: step.value,
    correction: step.correction,
  };
}

/**
 * Explains one interpolation: the zone, the step-one values per temperature column (each with its
 * divided-difference table, or pchip slopes), step two along temperature, the error estimate's parts
 * and the warnings. The value equals interpolateGrid's to rounding (it runs the general evaluator).
 */
export function explainInterpolation(
  grid: Grid,
  point: Point,
  options: Options,
): Explanation {
  const opts = normalizeOptions(options);
  const prep = prepareGrid(grid);
  checkPoint(point, -1);
  const plan = getPlan(prep, opts.method, opts.m, opts.n);
  const trace: Trace = {
    stepOne: [],
    stepTwo: null,
    errorPressure: 0,
    errorTemperature: 0,
    errorFactor: 0,
    errorFloor: 0,
    errorRounding: 0,
    errorGrowth: 1,
  };
  evaluateGeneral(
    plan,
    point.pressure,
    point.temperature,
    opts.reach,
    plan.single,
    0,
    -1,
    trace,
  );
  const buf = plan.single;
  const flags = buf.warnings[0]!;
  const value = buf.values[0]!;
  const errorEstimate = buf.errorEstimates[0]!;
  const pressure = Math.abs(trace.errorPressure);
  const temperature = Math.abs(trace.errorTemperature);
  return {
    method: opts.method,
    point: { pressure: point.pressure, temperature: point.temperature },
    degree: opts.method === "pchip" ? null : [opts.m, opts.n],
    branch:
      prep.bubble && buf.branches
        ? {
            side: buf.branches[0] === 1 ? "saturated" : "undersaturated",
            bubblePointPressure: plan.scratch.pbStar,
          }
        : null,
    stepOne: trace.stepOne.map((s) =>
      toStep(s, "pressure", point.pressure, grid.temperatures, opts.method),
    ),
    stepTwo: toStep(
      trace.stepTwo!,
      "temperature",
      point.temperature,
      grid.temperatures,
      opts.method,
    ),
    value,
    errorEstimate,
    errorParts: {
      pressure,
      temperature,
      factor: trace.errorFactor,
      floor: trace.errorFloor,
      rounding: trace.errorRounding,
      growth: trace.errorGrowth,
    },
    warnings: warningsFromFlags(flags),
    stencil: stencilLists(plan),
    alternative:
      flags & W_OVERSHOOT
        ? { method: "pchip", value: buf.alternatives?.[0] ?? value }
        : null,
  };
}
