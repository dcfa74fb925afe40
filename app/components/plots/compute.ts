/**
 * The numbers behind the plots, computed in the browser with the interpolation engine: a surface on a fine
 * pressure–temperature grid, curves along pressure at fixed temperatures, bubble points and query points.
 * Pure (no React, no Plotly), so it is unit-tested directly.
 */
import { WARNING_FLAGS, type Grid } from "~/core/interpolation";
import { bubblePointsAt, lookupCanonical } from "~/core/lookup";
import type { PlotGrid, PlotMethod, QueryFlag, QueryPoint } from "./types";

/**
 * Plotly refines every surface onto a finer uniform mesh of at least 120 nodes per axis, and when the input
 * spacing is uneven it takes the least common multiple of the spacings, up to 1,260 nodes per axis: about 1.6
 * million vertices, seconds of work with software WebGL. The surface is therefore sampled on an evenly spaced
 * grid (measured nodes are not inserted), and 60 × 30 refines to exactly 120 × 120.
 */
export const DEFAULT_SURFACE_RESOLUTION = {
  pressures: 60,
  temperatures: 30,
} as const;
export const DEFAULT_CURVE_RESOLUTION = 120;

type Evaluation = {
  /** NaN where the engine refused the point (missing zone, out of range, …). */
  values: Float64Array;
  /** Warning mask per point (engine bits; 0 where refused). */
  flags: Uint16Array;
  refused: Uint8Array;
};

function normalizeDegree(
  degree: number | [number, number] | undefined,
): [number, number] {
  if (degree === undefined) return [3, 3];
  return typeof degree === "number" ? [degree, degree] : degree;
}

function asGrid(grid: PlotGrid): Grid {
  return grid.bubblePoints
    ? grid
    : {
        pressures: grid.pressures,
        temperatures: grid.temperatures,
        values: grid.values,
      };
}

/**
 * Interpolates many points in one batch. Points the engine refuses (outside the range, no measured values
 * around them, too far to extrapolate, an impossible value) are left NaN and marked `refused`; the others are
 * served as usual. Bad grids or options still throw.
 */
export function evaluatePoints(
  grid: PlotGrid,
  pressures: Float64Array,
  temperatures: Float64Array,
  method: PlotMethod,
  degree: number | [number, number] | undefined,
  extrapolate: boolean,
): Evaluation {
  const n = pressures.length;
  const out = lookupCanonical(asGrid(grid), pressures, temperatures, {
    method,
    degree: normalizeDegree(degree),
    extrapolate,
  });
  const refused = new Uint8Array(n);
  const values = Float64Array.from(out.values);
  const flags = Uint16Array.from(out.flags);
  if (out.refusals) {
    for (let i = 0; i < n; i++) {
      if (out.refusals[i]! !== 0) {
        refused[i] = 1;
        values[i] = Number.NaN;
        flags[i] = 0;
      }
    }
  }
  return { values, flags, refused };
}

/** n evenly spaced values from a to b, merged with `extra` values inside [a, b], sorted, without near-duplicates. */
export function axisWith(
  a: number,
  b: number,
  n: number,
  extra: readonly number[] = [],
): number[] {
  const base: number[] = [];
  if (n <= 1 || a === b) base.push(a);
  else for (let i = 0; i < n; i++) base.push(a + ((b - a) * i) / (n - 1));
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const all = [
    ...base,
    ...extra.filter((v) => Number.isFinite(v) && v >= lo && v <= hi),
  ].sort((x, y) => x - y);
  const tol = Math.max(Math.abs(hi - lo), Math.abs(hi), 1) * 1e-9;
  const out: number[] = [];
  for (const v of all)
    if (out.length === 0 || v - out[out.length - 1]! > tol) out.push(v);
  return out;
}

type MeasuredPoint = {
  pressure: number;
  temperature: number;
  value: number;
};

export function measuredPoints(grid: PlotGrid): MeasuredPoint[] {
  const out: MeasuredPoint[] = [];
  grid.pressures.forEach((p, i) => {
    grid.temperatures.forEach((t, j) => {
      const v = grid.values[i]?.[j];
      if (v !== null && v !== undefined && Number.isFinite(v))
        out.push({ pressure: p, temperature: t, value: v });
    });
  });
  return out;
}

type Surface = {
  /** Pressures (x), temperatures (y); z[k][i] at temperature k and pressure i, null where refused. */
  pressures: number[];
  temperatures: number[];
  z: (number | null)[][];
  min: number;
  max: number;
};

/** The property on an evenly spaced fine grid over the measured range, interpolated by the engine (no extrapolation). */
export function surfaceOf(
  grid: PlotGrid,
  method: PlotMethod,
  degree: number | [number, number] | undefined,
  resolution: {
    pressures: number;
    temperatures: number;
  } = DEFAULT_SURFACE_RESOLUTION,
): Surface {
  const P = grid.pressures;
  const T = grid.temperatures;
  const pressures = axisWith(P[0]!, P[P.length - 1]!, resolution.pressures);
  const temperatures = axisWith(
    T[0]!,
    T[T.length - 1]!,
    resolution.temperatures,
  );
  const np = pressures.length;
  const nt = temperatures.length;
  const ps = new Float64Array(np * nt);
  const ts = new Float64Array(np * nt);
  for (let k = 0; k < nt; k++) {
    for (let i = 0; i < np; i++) {
      ps[k * np + i] = pressures[i]!;
      ts[k * np + i] = temperatures[k]!;
    }
  }
  const { values } = evaluatePoints(grid, ps, ts, method, degree, false);
  let min = Infinity;
  let max = -Infinity;
  const z: (number | null)[][] = [];
  for (let k = 0; k < nt; k++) {
    const row: (number | null)[] = [];
    for (let i = 0; i < np; i++) {
      const v = values[k * np + i]!;
      if (Number.isFinite(v)) {
        row.push(v);
        if (v < min) min = v;
        if (v > max) max = v;
      } else row.push(null);
    }
    z.push(row);
  }
  return { pressures, temperatures, z, min, max };
}

/** Bubble-point pressure at each temperature (as the engine interpolates it), or null for grids without one. */
function bubblePointsOf(
  grid: PlotGrid,
  temperatures: readonly number[],
  method: PlotMethod,
  degree: number | [number, number] | undefined,
): (number | null)[] {
  if (!grid.bubblePoints || temperatures.length === 0)
    return temperatures.map(() => null);
  try {
    const out = bubblePointsAt(
      asGrid(grid),
      Float64Array.from(temperatures),
      method === "auto" ? "newton" : method,
      normalizeDegree(degree)[1],
    );
    return temperatures.map((_, k) =>
      out && Number.isFinite(out[k]!) ? out[k]! : null,
    );
  } catch {
    return temperatures.map(() => null);
  }
}

type Curve = {
  temperature: number;
  pressures: number[];
  /** null where the engine refused. */
  values: (number | null)[];
  bubblePoint: { pressure: number; value: number | null } | null;
  /** Measured points of the column at this temperature, if it is a measured temperature. */
  measured: { pressure: number; value: number }[];
};

/** Property against pressure at one temperature, over the measured pressure range. */
export function curveOf(
  grid: PlotGrid,
  temperature: number,
  method: PlotMethod,
  degree: number | [number, number] | undefined,
  resolution = DEFAULT_CURVE_RESOLUTION,
): Curve {
  const P = grid.pressures;
  const pMin = P[0]!;
  const pMax = P[P.length - 1]!;
  const pb = bubblePointsOf(grid, [temperature], method, degree)[0] ?? null;
  const pressures = axisWith(
    pMin,
    pMax,
    resolution,
    pb === null ? P : [...P, pb],
  );
  const ts = new Float64Array(pressures.length).fill(temperature);
  const { values } = evaluatePoints(
    grid,
    Float64Array.from(pressures),
    ts,
    method,
    degree,
    false,
  );
  const list = Array.from(values, (v) => (Number.isFinite(v) ? v : null));
  let bubblePoint: Curve["bubblePoint"] = null;
  if (pb !== null) {
    const at = pressures.findIndex(
      (p) => Math.abs(p - pb) <= Math.max(Math.abs(pb), 1) * 1e-9,
    );
    bubblePoint = { pressure: pb, value: at >= 0 ? (list[at] ?? null) : null };
  }
  const T = grid.temperatures;
  const tol = Math.max(Math.abs(T[T.length - 1]! - T[0]!), 1) * 1e-6;
  const j = T.findIndex((t) => Math.abs(t - temperature) <= tol);
  const measured: Curve["measured"] = [];
  if (j >= 0) {
    P.forEach((p, i) => {
      const v = grid.values[i]?.[j];
      if (v !== null && v !== undefined && Number.isFinite(v))
        measured.push({ pressure: p, value: v });
    });
  }
  return { temperature, pressures, values: list, bubblePoint, measured };
}

export type EvaluatedQuery = QueryPoint & {
  label: string;
  /** null when the engine cannot give a value even with extrapolation. */
  value: number | null;
  flag: QueryFlag;
};

/** Values of the query points on one series (extrapolation allowed, and flagged). */
export function evaluateQueries(
  grid: PlotGrid,
  queries: readonly QueryPoint[],
  method: PlotMethod,
  degree: number | [number, number] | undefined,
): EvaluatedQuery[] {
  if (queries.length === 0) return [];
  const ps = Float64Array.from(queries, (q) => q.pressure);
  const ts = Float64Array.from(queries, (q) => q.temperature);
  const ok = queries.every(
    (q) => Number.isFinite(q.pressure) && Number.isFinite(q.temperature),
  );
  const evaluation = ok
    ? evaluatePoints(grid, ps, ts, method, degree, true)
    : null;
  const P = grid.pressures;
  const T = grid.temperatures;
  return queries.map((q, k) => {
    const label = q.label ?? `Q${k + 1}`;
    const inRange =
      q.pressure >= P[0]! &&
      q.pressure <= P[P.length - 1]! &&
      q.temperature >= T[0]! &&
      q.temperature <= T[T.length - 1]!;
    const v = evaluation?.values[k];
    if (!evaluation || v === undefined || !Number.isFinite(v))
      return { ...q, label, value: null, flag: "unavailable" };
    const flags = evaluation.flags[k]!;
    const flag: QueryFlag = !inRange
      ? "extrapolated"
      : flags & WARNING_FLAGS.extrapolated
        ? "beyond-envelope"
        : "inside";
    return { ...q, label, value: v, flag };
  });
}

export const QUERY_FLAG_TEXT: Record<QueryFlag, string> = {
  inside: "inside the measured data",
  extrapolated: "extrapolated: outside the measured pressure–temperature range",
  "beyond-envelope":
    "beyond the measured envelope: inside the table's range, but past the last measured cell of a column",
  unavailable: "no value: the engine cannot serve this point",
};
