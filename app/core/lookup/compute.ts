/**
 * The canonical core of a lookup: typed arrays in (psia, °F), typed arrays out (the property's canonical
 * unit). Shared by runLookup, runLookupColumns and the black-oil tables. Runs the engine's batch path once
 * for the requested method and, only for the few points where Newton overshoots, a second small pchip batch
 * (the value used by the automatic method, or the alternative offered next to an explicit Newton value).
 */
import {
  DEFAULT_MAX_EXTRAPOLATION,
  interpolateGridMany,
  WARNING_FLAGS,
  type Grid,
  type Method,
} from "../interpolation";
import type { PropertyKey } from "../units";
import { bubblePointsAt } from "./bubble-point";
import { PHYSICAL_LIMITS, REFUSED_IMPOSSIBLE } from "./refusals";
import {
  NEAR_BUBBLE_POINT_FRACTION,
  W_NEAR_BUBBLE_POINT,
  W_PCHIP_FALLBACK,
} from "./warnings";

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
  /** With `extrapolate`: the engine's maxExtrapolation (fraction of the axis span; default 0.25). */
  maxExtrapolation?: number;
  /**
   * The property the grid holds: physically impossible values (PHYSICAL_LIMITS) are then refused with
   * `impossible-value`. Without it values are not judged (plots of arbitrary grids).
   */
  property?: PropertyKey;
};

/**
 * Per point: value and error estimate (canonical unit of the property; NaN where refused, and the error
 * estimate NaN where the engine has none); warning mask (LOOKUP_WARNING_FLAGS bits); method used
 * (METHOD_CODES index; meaningless where refused); the pchip alternative where an explicit Newton value
 * overshoots (NaN elsewhere); the stencil span; branch (1 saturated, 2 undersaturated, 0 where a refused
 * point has none) and bubble-point pressure (psia) when the grid has bubble points; refusals (0 served,
 * k = LOOKUP_REFUSAL_CODES[k − 1]), null when every point was served.
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
  refusals: Uint8Array | null;
  /** Indices of the points that got a second (pchip) pass, ascending. */
  overshoots: Int32Array;
};

/** The engine options of a canonical lookup (also used to re-run a refused point for its message). */
export function engineOptions(options: CanonicalOptions): {
  method: Method;
  degree: [number, number];
  extrapolate: boolean;
  maxExtrapolation: number;
} {
  return {
    method: options.method === "auto" ? "newton" : options.method,
    degree: options.degree,
    extrapolate: options.extrapolate,
    maxExtrapolation: options.maxExtrapolation ?? DEFAULT_MAX_EXTRAPOLATION,
  };
}

/**
 * Runs the engine. A point that cannot be served is refused in place (`refusals`); only a malformed grid or
 * options throw (engine errors propagate: the caller maps them to its own error type).
 */
export function lookupCanonical(
  grid: Grid,
  ps: Float64Array,
  ts: Float64Array,
  options: CanonicalOptions,
): CanonicalLookup {
  const eo = engineOptions(options);
  const engineMethod = eo.method;
  const main = interpolateGridMany(
    grid,
    { pressures: ps, temperatures: ts },
    eo,
  );
  const n = main.count;
  const methods = new Uint8Array(n).fill(
    engineMethod === "newton"
      ? NEWTON
      : engineMethod === "pchip"
        ? PCHIP
        : LINEAR,
  );
  // own mask array: the lookup's bits lie above the engine's
  const flags = Uint16Array.from(main.warnings);
  const hasBubble = main.branches !== null;
  const bubblePoints = hasBubble
    ? bubblePointsAt(grid, ts, engineMethod, options.degree[1])
    : null;
  const refusals = main.refusals;

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
    // as the engine computes its own alternative: pchip, never refusing a point Newton could serve (a
    // point the pchip pass refuses all the same keeps its Newton value and gets no alternative)
    const sub = interpolateGridMany(
      grid,
      { pressures: sp, temperatures: st },
      { method: "pchip", extrapolate: true, maxExtrapolation: Infinity },
    );
    const subRefused = sub.refusals;
    if (options.method === "auto") {
      const subPb = hasBubble
        ? bubblePointsAt(grid, st, "pchip", options.degree[1])
        : null;
      for (let k = 0; k < count; k++) {
        if (subRefused && subRefused[k] !== 0) continue;
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
        if (subRefused && subRefused[k] !== 0) continue;
        const i = overshoots[k]!;
        alternatives[i] = sub.values[k]!;
        alternativeErrors[i] = sub.errorEstimates[k]!;
      }
    }
  }
  const result: CanonicalLookup = {
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
    refusals,
    overshoots,
  };
  if (options.property !== undefined)
    refuseImpossible(result, options.property);
  if (bubblePoints) flagNearBubblePoint(result, grid.pressures, ps);
  return result;
}

/** Refuses, with `impossible-value`, served points whose value is physically impossible for `property`. */
function refuseImpossible(r: CanonicalLookup, property: PropertyKey): void {
  const { values, count } = r;
  const limit = PHYSICAL_LIMITS[property];
  const min = limit.min;
  for (let i = 0; i < count; i++) {
    const v = values[i]!;
    // NaN (already refused) compares false both ways and is skipped
    if (limit.strict ? v <= min : v < min) {
      (r.refusals ??= new Uint8Array(count))[i] = REFUSED_IMPOSSIBLE;
      values[i] = NaN;
      r.errorEstimates[i] = NaN;
      r.flags[i] = 0;
      r.pressureStart[i] = 0;
      r.pressureCount[i] = 0;
      r.temperatureStart[i] = 0;
      r.temperatureCount[i] = 0;
      if (r.alternatives) r.alternatives[i] = NaN;
      if (r.alternativeErrors) r.alternativeErrors[i] = NaN;
    }
  }
}

/** Sets W_NEAR_BUBBLE_POINT on served points near pb (rule: warnings.ts, NEAR_BUBBLE_POINT_FRACTION). */
function flagNearBubblePoint(
  r: CanonicalLookup,
  P: readonly number[],
  ps: Float64Array,
): void {
  const pbs = r.bubblePoints!;
  const refused = r.refusals;
  const N = P.length;
  for (let i = 0; i < r.count; i++) {
    if (refused && refused[i] !== 0) continue;
    const pb = pbs[i]!;
    const d = Math.abs(ps[i]! - pb);
    if (!(d <= NEAR_BUBBLE_POINT_FRACTION * pb)) continue;
    let step = Infinity;
    if (N >= 2) {
      // the spacing of the two grid pressures around pb (or the nearest two outside them)
      let k = 0;
      while (k < N - 2 && P[k + 1]! <= pb) k++;
      step = P[k + 1]! - P[k]!;
    }
    if (d <= step) r.flags[i] = r.flags[i]! | W_NEAR_BUBBLE_POINT;
  }
}
