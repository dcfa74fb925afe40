/**
 * First steps of runQc: keep only well-formed grids (rule grid-shape), gather the temperatures, and settle
 * the bubble point at each temperature (rule bubble-point).
 */
import {
  isPropertyKey,
  PROPERTY_KEYS,
  RANKINE_OFFSET,
  type PropertyKey,
} from "../../units";
import { HEADER_LABELS } from "../header-names";
import type { PropertyGrid } from "../types";
import {
  cell,
  QcContext,
  TEMPERATURE_TOLERANCE,
  type BubbleAt,
} from "./context";
import { formatReading } from "../../format";

function isFiniteNumber(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x);
}

function strictlyIncreasing(xs: readonly number[]): boolean {
  return xs.every(
    (x, i) => i === 0 || x > (xs[i - 1] ?? Number.NEGATIVE_INFINITY),
  );
}

/** Why a grid cannot be checked, or null when it is well formed. */
function gridProblem(grid: PropertyGrid): string | null {
  const { pressures, temperatures, values } = grid;
  if (
    !Array.isArray(pressures) ||
    !Array.isArray(temperatures) ||
    !Array.isArray(values)
  ) {
    return "its pressures, temperatures or values are missing";
  }
  if (pressures.length === 0 || temperatures.length === 0)
    return "it has no pressures or no temperatures";
  if (!pressures.every(isFiniteNumber) || !temperatures.every(isFiniteNumber))
    return "a pressure or temperature is not a finite number";
  if (!pressures.every((p) => p > 0))
    return "a pressure is not above zero absolute";
  if (!temperatures.every((t) => t > -RANKINE_OFFSET))
    return "a temperature is below absolute zero";
  if (!strictlyIncreasing(pressures))
    return "its pressures are not strictly increasing (a pressure is repeated or out of order)";
  if (!strictlyIncreasing(temperatures))
    return "its temperatures are not strictly increasing (a temperature is repeated or out of order)";
  if (values.length !== pressures.length)
    return `it has ${values.length} rows of values for ${pressures.length} pressures`;
  for (const row of values) {
    if (!Array.isArray(row) || row.length !== temperatures.length)
      return "a row of values does not have one value per temperature";
    if (!row.every((v) => v === null || isFiniteNumber(v)))
      return "a value is neither a number nor empty";
  }
  return null;
}

export function checkGridShapes(ctx: QcContext): void {
  const properties = ctx.dataset?.properties ?? {};
  for (const [key, grid] of Object.entries(properties) as [
    string,
    PropertyGrid | undefined,
  ][]) {
    if (!grid) continue;
    if (!isPropertyKey(key)) {
      ctx.add(
        "grid-shape",
        "INVALID_GRID",
        "error",
        [],
        `The dataset holds a grid for "${key}", which is not a property Isopleth knows, so it was not checked.`,
      );
      continue;
    }
    const problem = gridProblem(grid);
    if (problem) {
      ctx.add(
        "grid-shape",
        "INVALID_GRID",
        "error",
        [],
        `The ${HEADER_LABELS[key]} grid cannot be checked because ${problem}.`,
      );
      continue;
    }
    ctx.grids.set(key, grid);
  }
  const temperatures: number[] = [];
  for (const key of PROPERTY_KEYS) {
    for (const t of ctx.grids.get(key)?.temperatures ?? []) {
      if (!temperatures.some((u) => Math.abs(u - t) <= TEMPERATURE_TOLERANCE))
        temperatures.push(t);
    }
  }
  ctx.temperatures = temperatures.sort((a, b) => a - b);
}

const OIL_KEYS: readonly PropertyKey[] = [
  "oil_fvf",
  "solution_gor",
  "oil_viscosity",
  "oil_density",
];

export function resolveBubblePoints(ctx: QcContext): void {
  const stated = (ctx.dataset?.bubblePoints ?? []).filter(
    (b) =>
      isFiniteNumber(b?.temperature) &&
      isFiniteNumber(b?.pressure) &&
      b.pressure > 0,
  );
  const fromSample = (ctx.meta.bubblePoints ?? []).filter(
    (b) =>
      isFiniteNumber(b?.temperature) &&
      isFiniteNumber(b?.pressure) &&
      b.pressure > 0,
  );
  const near = (
    list: readonly { temperature: number; pressure: number }[],
    t: number,
  ) => list.find((b) => Math.abs(b.temperature - t) <= TEMPERATURE_TOLERANCE);

  // Bubble points stated in the file or the sample record, also at temperatures without grids (for trends).
  const temperatures = [...ctx.temperatures];
  for (const b of [...stated, ...fromSample]) {
    if (
      !temperatures.some(
        (t) => Math.abs(t - b.temperature) <= TEMPERATURE_TOLERANCE,
      )
    )
      temperatures.push(b.temperature);
  }
  temperatures.sort((a, b) => a - b);

  for (const t of temperatures) {
    const file = near(stated, t);
    const sample = near(fromSample, t);
    if (
      file &&
      sample &&
      Math.abs(file.pressure - sample.pressure) > 0.005 * sample.pressure
    ) {
      ctx.add(
        "bubble-point",
        "BUBBLE_POINT_MISMATCH",
        "warning",
        [cell("bubble_point", file.pressure, t)],
        `At ${ctx.t(t)} the file gives a bubble point of ${ctx.p(file.pressure)} but the sample record gives ${ctx.p(sample.pressure)}; the file's value was used for the checks.`,
      );
    }
    const chosen = file ?? sample;
    if (chosen) {
      ctx.bubble.set(t, {
        temperature: t,
        pressure: chosen.pressure,
        origin: file ? "file" : "sample",
      });
      continue;
    }
    const inferred = inferBubblePoint(ctx, t);
    if (inferred) {
      ctx.bubble.set(t, inferred.bubble);
      ctx.add(
        "bubble-point",
        "BUBBLE_POINT_INFERRED",
        "info",
        [cell("bubble_point", inferred.bubble.pressure, t)],
        inferred.message,
      );
      continue;
    }
    if (OIL_KEYS.some((k) => ctx.series(k, t).length > 0)) {
      ctx.add(
        "bubble-point",
        "BUBBLE_POINT_MISSING",
        "warning",
        [],
        `No bubble point is known at ${ctx.t(t)} and none could be inferred, so the oil properties there were not split into saturated and undersaturated branches; state it in the file or on the sample.`,
      );
    }
  }
}

/** Infer pb at T from where Rs stops rising, or from the peak of Bo. */
function inferBubblePoint(
  ctx: QcContext,
  t: number,
): { bubble: BubbleAt; message: string } | null {
  const rs = ctx.series("solution_gor", t);
  if (rs.length >= 3) {
    const max = Math.max(...rs.map((p) => p.value));
    const tol = Math.max(0.005 * max, 1);
    const plateau = rs.filter((p) => p.value >= max - tol);
    const start = plateau[0];
    const last = rs[rs.length - 1];
    if (start && last) {
      if (plateau.length >= 2) {
        return {
          bubble: {
            temperature: t,
            pressure: start.pressure,
            origin: "inferred",
          },
          message: `No bubble point is stated at ${ctx.t(t)}; ${ctx.p(start.pressure)} was inferred from where Rs stops rising (${formatReading(max)} scf/STB) and used to split the branches.`,
        };
      }
      if (start === last) {
        return {
          bubble: {
            temperature: t,
            pressure: last.pressure,
            origin: "inferred",
            lowerBound: true,
          },
          message: `No bubble point is stated at ${ctx.t(t)}; Rs rises up to the highest pressure, so every point there was treated as saturated (pb at or above ${ctx.p(last.pressure)}).`,
        };
      }
    }
  }
  const bo = ctx.series("oil_fvf", t);
  if (bo.length >= 3) {
    let peak = 0;
    bo.forEach((p, i) => {
      if (p.value > (bo[peak]?.value ?? Number.NEGATIVE_INFINITY)) peak = i;
    });
    const at = bo[peak];
    if (at && peak > 0 && peak < bo.length - 1) {
      return {
        bubble: { temperature: t, pressure: at.pressure, origin: "inferred" },
        message: `No bubble point is stated at ${ctx.t(t)}; ${ctx.p(at.pressure)} was inferred from the peak of Bo and used to split the branches.`,
      };
    }
  }
  return null;
}
