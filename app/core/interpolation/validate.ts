import { DEFAULT_MAX_EXTRAPOLATION } from "./range";
import { formatInMessage } from "../format";
import { describeBadNumber, InterpolationError } from "./errors";
import type { Grid, Method, Options } from "./types";

/** Highest polynomial degree accepted per axis. High degrees oscillate between nodes (Runge's phenomenon). */
export const MAX_DEGREE = 8;
export const DEFAULT_DEGREE = 3;

const AXIS_LABEL = {
  pressures: "pressure",
  temperatures: "temperature",
} as const;

function checkAxis(grid: Grid, name: "pressures" | "temperatures"): void {
  const axis: unknown = grid[name];
  if (!Array.isArray(axis)) {
    throw new InterpolationError(
      "invalid-grid-shape",
      `The grid has no ${name} array.`,
      { axis: AXIS_LABEL[name] },
    );
  }
  if (axis.length === 0) {
    throw new InterpolationError(
      "axis-empty",
      `The grid has no ${name}: at least one is needed.`,
      {
        axis: AXIS_LABEL[name],
      },
    );
  }
  for (let i = 0; i < axis.length; i++) {
    const v: unknown = axis[i];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new InterpolationError(
        "axis-not-finite",
        `${name}[${i}] is ${describeBadNumber(v)}; every ${AXIS_LABEL[name]} must be a finite number.`,
        { axis: AXIS_LABEL[name], index: i },
      );
    }
    if (i > 0) {
      const prev = axis[i - 1] as number;
      if (!(v > prev)) {
        const why =
          v === prev
            ? `the ${AXIS_LABEL[name]} ${formatInMessage(v)} appears twice`
            : `it is smaller than ${name}[${i - 1}] = ${formatInMessage(prev)}`;
        throw new InterpolationError(
          "axis-not-increasing",
          `${name} must be strictly increasing, but ${name}[${i}] = ${formatInMessage(v)}: ${why}.`,
          { axis: AXIS_LABEL[name], index: i, value: v, previous: prev },
        );
      }
    }
  }
}

/** Throws an InterpolationError describing the first problem found in the grid. */
export function validateGrid(grid: Grid): void {
  if (typeof grid !== "object" || grid === null) {
    throw new InterpolationError(
      "invalid-grid-shape",
      "The grid must be an object with pressures, temperatures and values.",
    );
  }
  checkAxis(grid, "pressures");
  checkAxis(grid, "temperatures");
  const { pressures, temperatures } = grid;
  const values: unknown = grid.values;
  if (!Array.isArray(values)) {
    throw new InterpolationError(
      "invalid-grid-shape",
      "The grid has no values array.",
    );
  }
  if (values.length !== pressures.length) {
    throw new InterpolationError(
      "ragged-values",
      `values has ${values.length} rows but there are ${pressures.length} pressures; values[i] must hold the row for pressures[i].`,
      { rows: values.length, pressures: pressures.length },
    );
  }
  for (let i = 0; i < values.length; i++) {
    const row: unknown = values[i];
    if (!Array.isArray(row) || row.length !== temperatures.length) {
      const got = Array.isArray(row)
        ? `${row.length} entries`
        : describeBadNumber(row);
      throw new InterpolationError(
        "ragged-values",
        `values[${i}] (pressure ${formatInMessage(pressures[i]!)}) has ${got} but there are ${temperatures.length} temperatures.`,
        { row: i, pressure: pressures[i] },
      );
    }
    for (let j = 0; j < row.length; j++) {
      const v: unknown = row[j];
      if (v === null) continue;
      if (typeof v !== "number" || !Number.isFinite(v)) {
        throw new InterpolationError(
          "value-not-finite",
          `values[${i}][${j}] (pressure ${formatInMessage(pressures[i]!)}, temperature ${formatInMessage(temperatures[j]!)}) is ${describeBadNumber(v)}; a measured value must be a finite number, and a cell that was not measured must be null.`,
          {
            row: i,
            column: j,
            pressure: pressures[i],
            temperature: temperatures[j],
          },
        );
      }
    }
  }
  const bubblePoints: unknown = grid.bubblePoints;
  if (bubblePoints === undefined) return;
  if (
    !Array.isArray(bubblePoints) ||
    bubblePoints.length !== temperatures.length
  ) {
    const got = Array.isArray(bubblePoints)
      ? `${bubblePoints.length} entries`
      : describeBadNumber(bubblePoints);
    throw new InterpolationError(
      "invalid-bubble-points",
      `bubblePoints has ${got} but there are ${temperatures.length} temperatures; give one bubble-point pressure (or null) per temperature column.`,
    );
  }
  for (let j = 0; j < bubblePoints.length; j++) {
    const v: unknown = bubblePoints[j];
    if (v === null) continue;
    if (typeof v !== "number" || !Number.isFinite(v)) {
      throw new InterpolationError(
        "invalid-bubble-points",
        `bubblePoints[${j}] (temperature ${formatInMessage(temperatures[j]!)}) is ${describeBadNumber(v)}; use a finite pressure, or null when it is not known.`,
        { column: j, temperature: temperatures[j] },
      );
    }
  }
}

export type NormalizedOptions = {
  method: Method;
  /** Requested degree along pressure / temperature (1 for linear; unused by pchip). */
  m: number;
  n: number;
  extrapolate: boolean;
  /** 0 without `extrapolate`; otherwise `maxExtrapolation` (see range.ts, `checkRange`). */
  reach: number;
};

function checkDegree(d: unknown, what: string): number {
  if (
    typeof d !== "number" ||
    !Number.isInteger(d) ||
    d < 1 ||
    d > MAX_DEGREE
  ) {
    throw new InterpolationError(
      "invalid-options",
      `${what} must be a whole number from 1 to ${MAX_DEGREE}; got ${describeBadNumber(d)}.`,
      { degree: d },
    );
  }
  return d;
}

/** Reads and checks options into `into` (reused by callers on the hot path) and returns it. */
export function normalizeOptions(
  options: Options,
  into: NormalizedOptions = {
    method: "linear",
    m: 1,
    n: 1,
    extrapolate: false,
    reach: 0,
  },
): NormalizedOptions {
  if (typeof options !== "object" || options === null) {
    throw new InterpolationError(
      "invalid-options",
      "Options are required, e.g. { method: 'newton' }.",
    );
  }
  const method: unknown = options.method;
  if (method !== "linear" && method !== "newton" && method !== "pchip") {
    throw new InterpolationError(
      "invalid-options",
      `method must be 'linear', 'newton' or 'pchip'; got ${describeBadNumber(method)}.`,
      { method },
    );
  }
  const degree: unknown = options.degree;
  let m = DEFAULT_DEGREE;
  let n = DEFAULT_DEGREE;
  if (Array.isArray(degree)) {
    if (degree.length !== 2) {
      throw new InterpolationError(
        "invalid-options",
        `degree as a list must be [pressure degree, temperature degree]; got ${degree.length} entries.`,
      );
    }
    m = checkDegree(degree[0], "The pressure degree");
    n = checkDegree(degree[1], "The temperature degree");
  } else if (degree !== undefined) {
    m = n = checkDegree(degree, "degree");
  }
  const extrapolate: unknown = options.extrapolate;
  if (extrapolate !== undefined && typeof extrapolate !== "boolean") {
    throw new InterpolationError(
      "invalid-options",
      `extrapolate must be true or false; got ${describeBadNumber(extrapolate)}.`,
    );
  }
  const max: unknown = options.maxExtrapolation;
  if (
    max !== undefined &&
    (typeof max !== "number" || Number.isNaN(max) || !(max > 0))
  ) {
    throw new InterpolationError(
      "invalid-options",
      `maxExtrapolation must be a number above 0 (a fraction of the axis span, Infinity for no limit); got ${describeBadNumber(max)}.`,
      { maxExtrapolation: max },
    );
  }
  if (method === "linear") m = n = 1;
  into.method = method;
  into.m = m;
  into.n = n;
  into.extrapolate = extrapolate === true;
  into.reach =
    extrapolate === true
      ? ((max as number | undefined) ?? DEFAULT_MAX_EXTRAPOLATION)
      : 0;
  return into;
}
