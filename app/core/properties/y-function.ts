/**
 * Standing's Y-function for constant-composition-expansion (CCE) data below the saturation pressure:
 *
 *   Y = (psat − p) / [ p · (Vt/Vsat − 1) ]        (absolute pressures, psia)
 *
 * For black oils Y is close to a straight line Y = a + b·p. The line is fitted by least squares; points far
 * off the line (typically just below psat, where a tiny volume error makes a large Y error) are excluded one
 * at a time: the point whose *deleted* relative residual (its distance from the line fitted without it,
 * divided by that line's value) is largest is dropped while that residual exceeds `tolerance` (default 5 %)
 * and more than `minimumPoints` (default 3) remain. Smoothed relative volumes come back from the line:
 *
 *   Vt/Vsat = 1 + (psat − p) / (p · (a + b p))
 *
 * The method is subjective and non-unique; every decision (which points were left out and why) is returned
 * so that it can be shown and stored with the smoothed table.
 */
import { PropertyInputError } from "./errors";
import {
  requirePositive,
  requirePressure,
  type PropertyWarning,
} from "./estimate";
import { formatDecimals } from "../format";

export interface CcePoint {
  /** psia */
  readonly pressure: number;
  /** Vt/Vsat */
  readonly relativeVolume: number;
}

export interface YFunctionPoint extends CcePoint {
  /** Y at the measured point; null when Vt/Vsat ≤ 1 (no Y below psat). */
  readonly y: number | null;
  readonly yFitted: number;
  /** y − yFitted (null when y is null). */
  readonly residual: number | null;
  /** residual / yFitted. */
  readonly relativeResidual: number | null;
  readonly smoothedRelativeVolume: number;
  readonly usedInFit: boolean;
  /** Excluded from the fit or more than `tolerance` off the final line. */
  readonly offLine: boolean;
}

export interface YFunctionFit {
  readonly saturationPressure: number;
  readonly intercept: number;
  readonly slope: number;
  /** Points below psat, sorted by descending pressure. */
  readonly points: readonly YFunctionPoint[];
  /** Points at or above psat, which the Y-function does not apply to (returned untouched). */
  readonly ignored: readonly CcePoint[];
  readonly warnings: readonly PropertyWarning[];
}

const METHOD = "standing-y-function";

/** Y at one point (p < psat, Vt/Vsat > 1). */
export function yFunction(
  input: { readonly saturationPressure: number } & CcePoint,
): number {
  const psat = requirePressure("saturationPressure", input.saturationPressure);
  const p = requirePressure("pressure", input.pressure);
  requirePositive("relativeVolume", input.relativeVolume);
  if (p >= psat) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "pressure",
      p,
      `Y is defined below psat only (p = ${p} ≥ ${psat} psia).`,
    );
  }
  if (input.relativeVolume <= 1) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      "relativeVolume",
      input.relativeVolume,
      `Vt/Vsat must exceed 1 below psat, got ${input.relativeVolume} at ${p} psia.`,
    );
  }
  return (psat - p) / (p * (input.relativeVolume - 1));
}

function fitLine(
  xs: readonly number[],
  ys: readonly number[],
): { intercept: number; slope: number } {
  const n = xs.length;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += xs[i] ?? 0;
    sy += ys[i] ?? 0;
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const dx = (xs[i] ?? 0) - mx;
    sxx += dx * dx;
    sxy += dx * ((ys[i] ?? 0) - my);
  }
  const slope = sxx === 0 ? 0 : sxy / sxx;
  return { intercept: my - slope * mx, slope };
}

export function smoothedRelativeVolume(
  fit: Pick<YFunctionFit, "saturationPressure" | "intercept" | "slope">,
  pressure: number,
): number {
  const p = requirePressure("pressure", pressure);
  return (
    1 + (fit.saturationPressure - p) / (p * (fit.intercept + fit.slope * p))
  );
}

export function fitYFunction(input: {
  readonly saturationPressure: number;
  readonly points: readonly CcePoint[];
  /** Relative deviation from the line beyond which a point is off the line. Default 0.05. */
  readonly tolerance?: number;
  /** Pressures (psia) to leave out of the fit by hand. */
  readonly exclude?: readonly number[];
  /** Drop off-line points automatically (default true). */
  readonly autoExclude?: boolean;
  readonly minimumPoints?: number;
}): YFunctionFit {
  const psat = requirePressure("saturationPressure", input.saturationPressure);
  const tolerance = requirePositive("tolerance", input.tolerance ?? 0.05);
  const minimumPoints = Math.max(3, input.minimumPoints ?? 3);
  const manual = new Set(input.exclude ?? []);
  const warnings: PropertyWarning[] = [];

  const below: Array<CcePoint & { y: number | null }> = [];
  const ignored: CcePoint[] = [];
  for (const point of input.points) {
    requirePressure("pressure", point.pressure);
    requirePositive("relativeVolume", point.relativeVolume);
    if (point.pressure >= psat) {
      ignored.push(point);
      continue;
    }
    const y =
      point.relativeVolume > 1
        ? yFunction({ saturationPressure: psat, ...point })
        : null;
    if (y === null) {
      warnings.push({
        code: "DATA_FLAG",
        method: METHOD,
        input: "relativeVolume",
        value: point.pressure,
        message: `Vt/Vsat = ${point.relativeVolume} ≤ 1 at ${point.pressure} psia, below psat: point left out.`,
      });
    }
    below.push({ ...point, y });
  }
  below.sort((a, b) => b.pressure - a.pressure);

  const used = new Set<number>();
  below.forEach((pt, i) => {
    if (pt.y !== null && !manual.has(pt.pressure)) used.add(i);
  });
  if (used.size < 2) {
    throw new PropertyInputError(
      "INSUFFICIENT_DATA",
      "points",
      used.size,
      `The Y-function line needs at least 2 usable points below psat, got ${used.size}.`,
    );
  }

  const lineOf = (indices: Iterable<number>) => {
    const xs: number[] = [];
    const ys: number[] = [];
    for (const i of indices) {
      const pt = below[i];
      if (pt?.y == null) continue;
      xs.push(pt.pressure);
      ys.push(pt.y);
    }
    return fitLine(xs, ys);
  };

  const autoExcluded = new Set<number>();
  if (input.autoExclude ?? true) {
    while (used.size > minimumPoints) {
      let worst = -1;
      let worstResidual = 0;
      for (const i of used) {
        const pt = below[i];
        if (pt?.y == null) continue;
        const others = [...used].filter((j) => j !== i);
        const line = lineOf(others);
        const predicted = line.intercept + line.slope * pt.pressure;
        const r = Math.abs(pt.y - predicted) / Math.abs(predicted);
        if (r > worstResidual) {
          worstResidual = r;
          worst = i;
        }
      }
      if (worst < 0 || worstResidual <= tolerance) break;
      used.delete(worst);
      autoExcluded.add(worst);
    }
  }

  const { intercept, slope } = lineOf(used);
  const points: YFunctionPoint[] = below.map((pt, i) => {
    const yFitted = intercept + slope * pt.pressure;
    const residual = pt.y === null ? null : pt.y - yFitted;
    const relativeResidual = residual === null ? null : residual / yFitted;
    const offLine =
      !used.has(i) ||
      (relativeResidual !== null && Math.abs(relativeResidual) > tolerance);
    return {
      pressure: pt.pressure,
      relativeVolume: pt.relativeVolume,
      y: pt.y,
      yFitted,
      residual,
      relativeResidual,
      smoothedRelativeVolume:
        1 + (psat - pt.pressure) / (pt.pressure * yFitted),
      usedInFit: used.has(i),
      offLine,
    };
  });
  for (const i of autoExcluded) {
    const pt = points[i];
    if (!pt || pt.residual === null) continue;
    warnings.push({
      code: "DATA_FLAG",
      method: METHOD,
      input: "pressure",
      value: pt.pressure,
      message:
        `Point at ${pt.pressure} psia lies ${pt.residual >= 0 ? "+" : ""}${formatDecimals(pt.residual, 3)} off the Y line ` +
        `(${formatDecimals((pt.relativeResidual ?? 0) * 100, 1)} %) and was left out of the fit` +
        (psat - pt.pressure < 0.05 * psat
          ? "; it is close to psat — check the saturation pressure."
          : "."),
    });
  }
  if (slope < 0) {
    warnings.push({
      code: "DATA_FLAG",
      method: METHOD,
      input: "slope",
      value: slope,
      message:
        "The Y line falls with pressure: unusual for a black oil — check psat and the readings.",
    });
  }
  return {
    saturationPressure: psat,
    intercept,
    slope,
    points,
    ignored,
    warnings,
  };
}
