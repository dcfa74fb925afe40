/**
 * The canonical core of a lookup: typed arrays in (psia, °F), typed arrays out (the property's canonical
 * unit). Shared by runLookup, runLookupColumns and the black-oil tables. Runs the engine's batch path once
 * for the requested method and, only for the few points where Newton overshoots, a second small pchip batch
 * (the value used by the automatic method, or the alternative offered next to an explicit Newton value).
 */
import {
  InterpolationError,
  interpolateGridMany,
  WARNING_FLAGS,
  type BatchResult,
  type Grid,
  type Method,
} from "../interpolation";
import { bubblePointsAt } from "./bubble-point";
import { W_PCHIP_FALLBACK } from "./warnings";

export type LookupMethod = "auto" | "newton" | "pchip" | "linear";
export type UsedMethod = Method;

export const LOOKUP_METHODS: readonly LookupMethod[] = [
  "auto",
  "newton",
  "pchip",
  "linear",
];

/** Codes of `CanonicalLookup.methods`. */
export const METHOD_CODES: readonly UsedMethod[] = [
  "newton",
  "pchip",
  "linear",
];
const NEWTON = 0;
const PCHIP = 1;
const LINEAR = 2;

export type CanonicalOptions = {
  method: LookupMethod;
  /** [pressure, temperature]; already checked. */
  degree: [number, number];
  extrapolate: boolean;
};

/**
 * Per point: value and error estimate (canonical unit of the property); warning mask (engine bits plus
 * W_PCHIP_FALLBACK); method used (METHOD_CODES index); the pchip alternative where an explicit Newton
 * value overshoots (NaN elsewhere); the stencil span; branch (1 saturated, 2 undersaturated) and
 * bubble-point pressure (psia) when the grid has bubble points.
 */
export type CanonicalLookup = {
  count: number;
  values: Float64Array;
  errorEstimates: Float64Array;
  flags: Uint16Array;
  methods: Uint8Array;
  alternatives: Float64Array | null;
  alternativeErrors: Float64Array | null;
  pressureStart: Int32Array;
  pressureCount: Uint8Array;
  temperatureStart: Int32Array;
  temperatureCount: Uint8Array;
  branches: Uint8Array | null;
  bubblePoints: Float64Array | null;
  /** Indices of the points that got a second (pchip) pass, ascending. */
  overshoots: Int32Array;
};

/** Runs the engine; engine errors propagate (the caller maps them to its own error type). */
export function lookupCanonical(
  grid: Grid,
  ps: Float64Array,
  ts: Float64Array,
  options: CanonicalOptions,
): CanonicalLookup {
  const engineMethod: Method =
    options.method === "auto" ? "newton" : options.method;
  const main = interpolateGridMany(
    grid,
    { pressures: ps, temperatures: ts },
    {
      method: engineMethod,
      degree: options.degree,
      extrapolate: options.extrapolate,
    },
  );
  const n = main.count;
  const methods = new Uint8Array(n).fill(
    engineMethod === "newton"
      ? NEWTON
      : engineMethod === "pchip"
        ? PCHIP
        : LINEAR,
  );
  // own mask array: the engine's masks fit in a byte, ours add W_PCHIP_FALLBACK above them
  const flags = Uint16Array.from(main.warnings);
  const hasBubble = main.branches !== null;
  const bubblePoints = hasBubble
    ? bubblePointsAt(grid, ts, engineMethod, options.degree[1])
    : null;

  // the points where Newton overshoots
  let count = 0;
  if (engineMethod === "newton")
    for (let i = 0; i < n; i++)
      if (flags[i]! & WARNING_FLAGS.overshoot) count++;
  const overshoots = new Int32Array(count);
  let alternatives: Float64Array | null = null;
  let alternativeErrors: Float64Array | null = null;
  if (count > 0) {
    const sp = new Float64Array(count);
    const st = new Float64Array(count);
    for (let i = 0, k = 0; i < n; i++) {
      if (flags[i]! & WARNING_FLAGS.overshoot) {
        overshoots[k] = i;
        sp[k] = ps[i]!;
        st[k] = ts[i]!;
        k++;
      }
    }
    // as the engine computes its own alternative: pchip, never refusing a point Newton could serve
    let sub: BatchResult;
    try {
      sub = interpolateGridMany(
        grid,
        { pressures: sp, temperatures: st },
        { method: "pchip", extrapolate: true },
      );
    } catch (error) {
      // report the point by its index in the caller's batch, not in this small one
      const k =
        error instanceof InterpolationError
          ? error.details.pointIndex
          : undefined;
      if (error instanceof InterpolationError && typeof k === "number") {
        throw new InterpolationError(error.code, error.message, {
          ...error.details,
          pointIndex: overshoots[k],
        });
      }
      throw error;
    }
    if (options.method === "auto") {
      const subPb = hasBubble
        ? bubblePointsAt(grid, st, "pchip", options.degree[1])
        : null;
      for (let k = 0; k < count; k++) {
        const i = overshoots[k]!;
        main.values[i] = sub.values[k]!;
        main.errorEstimates[i] = sub.errorEstimates[k]!;
        flags[i] =
          sub.warnings[k]! | WARNING_FLAGS.overshoot | W_PCHIP_FALLBACK;
        methods[i] = PCHIP;
        main.pressureStart[i] = sub.pressureStart[k]!;
        main.pressureCount[i] = sub.pressureCount[k]!;
        main.temperatureStart[i] = sub.temperatureStart[k]!;
        main.temperatureCount[i] = sub.temperatureCount[k]!;
        if (main.branches && sub.branches) main.branches[i] = sub.branches[k]!;
        if (bubblePoints && subPb) bubblePoints[i] = subPb[k]!;
      }
    } else {
      alternatives = new Float64Array(n).fill(Number.NaN);
      alternativeErrors = new Float64Array(n).fill(Number.NaN);
      for (let k = 0; k < count; k++) {
        const i = overshoots[k]!;
        alternatives[i] = sub.values[k]!;
        alternativeErrors[i] = sub.errorEstimates[k]!;
      }
    }
  }
  return {
    count: n,
    values: main.values,
    errorEstimates: main.errorEstimates,
    flags,
    methods,
    alternatives,
    alternativeErrors,
    pressureStart: main.pressureStart,
    pressureCount: main.pressureCount,
    temperatureStart: main.temperatureStart,
    temperatureCount: main.temperatureCount,
    branches: main.branches,
    bubblePoints,
    overshoots,
  };
}
