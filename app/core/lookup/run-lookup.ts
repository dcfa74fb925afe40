/**
 * runLookup: property values at many (pressure, temperature) points of a measured grid, in the caller's unit
 * system. Points arrive in field (psia, °F) or metric (bara, °C) units, are converted to canonical units,
 * interpolated by the engine's typed-array batch path, and values, error estimates, stencil coordinates and
 * bubble points are converted back to the units of that system.
 */
import {
  DEFAULT_DEGREE,
  DEFAULT_MAX_EXTRAPOLATION,
  InterpolationError,
  MAX_DEGREE,
  interpolateGrid,
  type Branch,
  type Grid,
  type Stencil,
} from "../interpolation";
import {
  CANONICAL_UNIT_SYSTEM,
  DEFAULT_SAMPLE_BAROMETRIC_PSIA,
  isPropertyKey,
  OUTPUT_SYSTEMS,
  outputPressureUnit,
  outputUnit,
  outputUnitSystem,
  PROPERTIES,
  PROPERTY_QUANTITIES,
  standardConditionsLabel,
  type OutputSystem,
  type PropertyKey,
  type UnitLabel,
} from "../units";
import {
  engineOptions,
  lookupCanonical,
  LOOKUP_METHODS,
  METHOD_CODES,
  type CanonicalLookup,
  type LookupMethod,
  type UsedMethod,
} from "./compute";
import { LookupError } from "./errors";
import {
  affineToCanonical,
  normalizeUnitBasis,
  type Affine,
  type UnitBasis,
} from "./unit-map";
import {
  expandWarningFlags,
  W_PCHIP_FALLBACK,
  type LookupWarning,
} from "./warnings";
import { formatPlain } from "../format";
import { formatApart } from "../format/distinct";
import {
  engineRefusal,
  PHYSICAL_LIMITS,
  REFUSED_IMPOSSIBLE,
  refusalCode,
  type LookupRefusalCode,
} from "./refusals";

/** Most points one lookup accepts (the API's limit). */
export const MAX_LOOKUP_POINTS = 100_000;

/** Largest `maxExtrapolation` accepted (ten spans). */
export const MAX_EXTRAPOLATION_LIMIT = 10;

export type LookupOptions = {
  /** 'auto': newton (degree [3,3] unless given) with the pchip value wherever Newton overshoots. */
  method: LookupMethod;
  /** Newton degree, one number for both axes or [pressure, temperature]; 1 to MAX_DEGREE. Default 3. */
  degree?: number | [number, number];
  /** Serve points outside the measured range (marked 'extrapolated'); otherwise they are refused. */
  extrapolate?: boolean;
  /**
   * With `extrapolate`: the farthest a point may lie outside the measured range, per axis, as a fraction
   * of that axis' measured span; 0 < x ≤ 10, default 0.25 (25 %). Farther points are refused
   * `extrapolation-too-far`.
   */
  maxExtrapolation?: number;
  property: PropertyKey;
  /** Unit system of the points and of everything returned. */
  units: OutputSystem;
  /** Plain-word messages next to the warning codes (default true). */
  messages?: boolean;
  /**
   * Standard conditions of the grid's Rs and Bg (the sample's); values come out rebased to those of `units`.
   * Default 60 °F, 14.696 psia (the canonical base: no rebase in field units).
   */
  standardConditions?: { temperatureF: number; pressurePsia: number };
  /** Points and output pressures as absolute (default) or gauge (psig in field, barg in metric units). */
  pressureBasis?: "absolute" | "gauge";
  /** Barometric pressure of gauge pressures, psia (the sample's); default 14.696. */
  barometricPressurePsia?: number;
};

export type LookupPoint = { pressure: number; temperature: number };

/** Many points as two columns of equal length (typed arrays avoid a copy). */
export type LookupPointColumns = {
  pressures: Float64Array | readonly number[];
  temperatures: Float64Array | readonly number[];
};

export type LookupPoints = readonly LookupPoint[] | LookupPointColumns;

/**
 * The measured cells behind a value. `columns` lists them exactly, column by column (ascending
 * temperature): the grid column index and its temperature, and the grid rows used by that column and
 * their pressures, all in the output units; every listed cell was measured. With missing cells or bubble
 * points a column may use its own rows. A column whose zone also used the bubble-point node inserted
 * between two grid rows (not a grid cell; its pressure is `bubblePointPressure` of the column's own
 * temperature) has `bubblePointNode: true`. `pressureIndices`/`pressures` are every row used by some
 * column, `temperatureIndices`/`temperatures` every column used. `explainInterpolation` shows every node
 * of one point with its value.
 */
export type LookupStencil = {
  readonly pressureIndices: readonly number[];
  readonly temperatureIndices: readonly number[];
  readonly pressures: readonly number[];
  readonly temperatures: readonly number[];
  readonly columns: readonly LookupStencilColumn[];
};

export type LookupStencilColumn = {
  readonly temperatureIndex: number;
  readonly temperature: number;
  readonly pressureIndices: readonly number[];
  readonly pressures: readonly number[];
  readonly bubblePointNode?: true;
};

/** Why a point was not served, in plain words (numbers in the caller's units; points counted from 1). */
export type LookupRefusal = { code: LookupRefusalCode; message: string };

export type LookupPointResult = {
  /** Null where the point is refused (`refused` says why). */
  value: number | null;
  /**
   * ≥ 0, in the value's unit; see the engine README, "Error estimate". Null where refused, and with a
   * served value where the table says nothing about the error there (the point then carries the warning
   * `estimate-unavailable`).
   */
  errorEstimate: number | null;
  /** Machine codes (shared frozen arrays: copy before changing). */
  warnings: readonly LookupWarning[];
  /** One plain-word sentence per warning (absent when there are none or messages: false). */
  messages?: readonly string[];
  /** The method that produced `value` ('pchip' where the automatic method fell back); null where refused. */
  method: UsedMethod | null;
  /** Null where refused. */
  stencil: LookupStencil | null;
  /** Oil grids (with bubble points): the branch of the point; null for gas grids. */
  branch: Branch | null;
  /** Oil grids: bubble-point pressure at the point's temperature, in the output pressure unit. */
  bubblePointPressure: number | null;
  /** Explicit newton only, where it overshoots: the shape-preserving value for the same point. */
  alternative?: { method: "pchip"; value: number; errorEstimate: number };
  /** Present only on a refused point. */
  refused?: LookupRefusal;
};

export type LookupUnitLabels = {
  system: OutputSystem;
  pressure: UnitLabel;
  temperature: UnitLabel;
  /** Unit of `value`, `errorEstimate` and `alternative`. */
  value: UnitLabel;
  /** Reference conditions of gas and oil volumes in this system (Rs, Bg, Bo). */
  standardConditions: string;
  /** The report's own standard conditions, from which Rs and Bg were rebased to `standardConditions`. */
  reportStandardConditions: string;
  /** Pressures (points, stencil, bubble points) absolute or gauge; see `pressure`. */
  pressureBasis: "absolute" | "gauge";
  /** Barometric pressure that makes a gauge pressure absolute, psia. */
  barometricPressurePsia: number;
};

export type LookupSummary = {
  count: number;
  /** Served points only. */
  methodCounts: Record<UsedMethod, number>;
  warningCounts: Partial<Record<LookupWarning, number>>;
  refusedCount: number;
  refusalCounts: Partial<Record<LookupRefusalCode, number>>;
};

export type LookupResult = {
  property: PropertyKey;
  method: LookupMethod;
  /** [pressure, temperature] degree of the polynomial method; null for pchip. */
  degree: [number, number] | null;
  /** Plain words for the method, e.g. "automatic: newton [3,3], pchip where newton overshoots". */
  methodDescription: string;
  extrapolate: boolean;
  units: LookupUnitLabels;
  results: LookupPointResult[];
  summary: LookupSummary;
};

/** The typed-array form (no object per point): for plots and large batches. */
export type LookupColumnsResult = {
  property: PropertyKey;
  method: LookupMethod;
  degree: [number, number] | null;
  methodDescription: string;
  extrapolate: boolean;
  units: LookupUnitLabels;
  count: number;
  /** NaN where refused. */
  values: Float64Array;
  /** NaN where refused or unavailable (warning `estimate-unavailable`). */
  errorEstimates: Float64Array;
  /** Warning mask per point: LOOKUP_WARNING_FLAGS bits (0 where refused); see lookupWarningsFromFlags. */
  warnings: Uint16Array;
  /** Index into METHOD_CODES ('newton', 'pchip', 'linear') per point; meaningless where refused. */
  methods: Uint8Array;
  /** 1 saturated, 2 undersaturated (oil grids), else null. */
  branches: Uint8Array | null;
  /** Output pressure unit (oil grids), else null. */
  bubblePointPressures: Float64Array | null;
  /** Explicit newton: pchip value where it overshoots, NaN elsewhere; null when there is none. */
  alternatives: Float64Array | null;
  alternativeErrors: Float64Array | null;
  /** First grid index and span of the stencil along each axis (see the engine's BatchResult). */
  pressureStart: Int32Array;
  pressureCount: Uint8Array;
  temperatureStart: Int32Array;
  temperatureCount: Uint8Array;
  /** Null when every point was served; else 0 = served, k = LOOKUP_REFUSAL_CODES[k − 1]. */
  refusals: Uint8Array | null;
  /** Null when every point was served; else the message of each refused point (undefined elsewhere). */
  refusalMessages: (string | undefined)[] | null;
  summary: LookupSummary;
};

export type NormalizedLookupOptions = {
  method: LookupMethod;
  degree: [number, number];
  extrapolate: boolean;
  maxExtrapolation: number;
  property: PropertyKey;
  units: OutputSystem;
  messages: boolean;
  basis: UnitBasis;
};

function describe(value: unknown): string {
  if (typeof value === "string") return JSON.stringify(value);
  if (
    typeof value === "number" ||
    typeof value === "boolean" ||
    value === null ||
    value === undefined
  )
    return String(value);
  return `a ${Array.isArray(value) ? "list" : typeof value}`;
}

function checkDegree(d: unknown, what: string): number {
  if (
    typeof d !== "number" ||
    !Number.isInteger(d) ||
    d < 1 ||
    d > MAX_DEGREE
  ) {
    throw new LookupError(
      "INVALID_OPTIONS",
      `${what} must be a whole number from 1 to ${MAX_DEGREE}; got ${describe(d)}.`,
      {
        field: "degree",
      },
    );
  }
  return d;
}

/** Checks lookup options; throws LookupError INVALID_OPTIONS naming the field. */
export function normalizeLookupOptions(
  options: LookupOptions,
): NormalizedLookupOptions {
  if (typeof options !== "object" || options === null) {
    throw new LookupError(
      "INVALID_OPTIONS",
      "Lookup options are required: { method, property, units }.",
    );
  }
  const method: unknown = options.method;
  if (
    typeof method !== "string" ||
    !(LOOKUP_METHODS as readonly string[]).includes(method)
  ) {
    throw new LookupError(
      "INVALID_OPTIONS",
      `method must be one of ${LOOKUP_METHODS.join(", ")}; got ${describe(method)}.`,
      {
        field: "method",
      },
    );
  }
  const property: unknown = options.property;
  if (typeof property !== "string" || !isPropertyKey(property)) {
    throw new LookupError(
      "INVALID_OPTIONS",
      `property must be one of oil_fvf, solution_gor, oil_viscosity, oil_density, gas_fvf, gas_viscosity, z_factor; got ${describe(property)}.`,
      { field: "property" },
    );
  }
  const units: unknown = options.units;
  if (
    typeof units !== "string" ||
    !(OUTPUT_SYSTEMS as readonly string[]).includes(units)
  ) {
    throw new LookupError(
      "INVALID_OPTIONS",
      `units must be 'field' or 'metric'; got ${describe(units)}.`,
      { field: "units" },
    );
  }
  const extrapolate: unknown = options.extrapolate;
  if (extrapolate !== undefined && typeof extrapolate !== "boolean") {
    throw new LookupError(
      "INVALID_OPTIONS",
      `extrapolate must be true or false; got ${describe(extrapolate)}.`,
      {
        field: "extrapolate",
      },
    );
  }
  const messages: unknown = options.messages;
  if (messages !== undefined && typeof messages !== "boolean") {
    throw new LookupError(
      "INVALID_OPTIONS",
      `messages must be true or false; got ${describe(messages)}.`,
      { field: "messages" },
    );
  }
  const maxExtrapolation: unknown = options.maxExtrapolation;
  if (
    maxExtrapolation !== undefined &&
    (typeof maxExtrapolation !== "number" ||
      !(maxExtrapolation > 0 && maxExtrapolation <= MAX_EXTRAPOLATION_LIMIT))
  ) {
    throw new LookupError(
      "INVALID_OPTIONS",
      `maxExtrapolation must be a number above 0 and at most ${MAX_EXTRAPOLATION_LIMIT} (a fraction of the measured span of each axis; 0.25 = 25 %); got ${describe(maxExtrapolation)}.`,
      { field: "maxExtrapolation" },
    );
  }
  const degree: unknown = options.degree;
  let m = DEFAULT_DEGREE;
  let n = DEFAULT_DEGREE;
  if (Array.isArray(degree)) {
    if (degree.length !== 2) {
      throw new LookupError(
        "INVALID_OPTIONS",
        `degree as a list must be [pressure degree, temperature degree]; got ${degree.length} entries.`,
        { field: "degree" },
      );
    }
    m = checkDegree(degree[0], "The pressure degree");
    n = checkDegree(degree[1], "The temperature degree");
  } else if (degree !== undefined) {
    m = n = checkDegree(degree, "degree");
  }
  if (method === "linear") m = n = 1;
  return {
    method: method as LookupMethod,
    degree: [m, n],
    extrapolate: extrapolate === true,
    maxExtrapolation:
      (maxExtrapolation as number | undefined) ?? DEFAULT_MAX_EXTRAPOLATION,
    property,
    units: units as OutputSystem,
    messages: messages !== false,
    basis: normalizeUnitBasis(options),
  };
}

/** Plain words for a method and degree. */
export function describeLookupMethod(
  method: LookupMethod,
  degree: [number, number] = [DEFAULT_DEGREE, DEFAULT_DEGREE],
): string {
  const d = `[${degree[0]},${degree[1]}]`;
  switch (method) {
    case "auto":
      return `automatic: newton ${d}, pchip where newton overshoots`;
    case "newton":
      return `newton ${d}`;
    case "pchip":
      return "pchip (shape-preserving cubic)";
    case "linear":
      return "linear";
  }
}

export type UnitContext = {
  pressure: Affine;
  temperature: Affine;
  value: Affine;
  labels: LookupUnitLabels;
};

/**
 * The conversions between the caller's units and the stored grid: `basis` says which standard conditions the
 * grid's Rs and Bg are on (the sample's) and whether pressures are gauge (normalizeUnitBasis checks it).
 */
export function unitContext(
  property: PropertyKey,
  units: OutputSystem,
  basis: UnitBasis = {},
): UnitContext {
  const system = outputUnitSystem(units);
  const quantity = PROPERTY_QUANTITIES[property];
  const pressureBasis = basis.pressureBasis ?? "absolute";
  return {
    pressure: affineToCanonical("pressure", system, basis),
    temperature: affineToCanonical("temperature", system),
    value: affineToCanonical(quantity, system, basis),
    labels: {
      system: units,
      pressure: outputPressureUnit(units, pressureBasis),
      temperature: outputUnit(units, "temperature"),
      value: outputUnit(units, quantity),
      standardConditions: system.standardConditions.label,
      reportStandardConditions: standardConditionsLabel(
        basis.standardConditions ?? CANONICAL_UNIT_SYSTEM.standardConditions,
      ),
      pressureBasis,
      barometricPressurePsia:
        basis.barometricPressurePsia ?? DEFAULT_SAMPLE_BAROMETRIC_PSIA,
    },
  };
}

const ABSOLUTE_ZERO_F = -459.67;

function badPoint(
  index: number,
  axis: "pressure" | "temperature",
  value: unknown,
  ctx: UnitContext,
  why: string,
): LookupError {
  const unit =
    axis === "pressure"
      ? ctx.labels.pressure.symbol
      : ctx.labels.temperature.symbol;
  return new LookupError(
    "INVALID_POINT",
    // counted from 1 as the user typed them; details.pointIndex stays 0-based
    `Point ${index + 1} has ${axis} ${describe(value)} ${unit}: ${why}`,
    {
      pointIndex: index,
      axis,
      value,
      unit,
    },
  );
}

function checkedPoint(
  i: number,
  p: unknown,
  t: unknown,
  ctx: UnitContext,
  ps: Float64Array,
  ts: Float64Array,
): void {
  if (typeof p !== "number" || !Number.isFinite(p))
    throw badPoint(i, "pressure", p, ctx, "a finite number is needed.");
  if (typeof t !== "number" || !Number.isFinite(t))
    throw badPoint(i, "temperature", t, ctx, "a finite number is needed.");
  const pc = p * ctx.pressure.scale + ctx.pressure.offset;
  const tc = t * ctx.temperature.scale + ctx.temperature.offset;
  if (!(pc > 0))
    throw badPoint(
      i,
      "pressure",
      p,
      ctx,
      ctx.labels.pressureBasis === "gauge"
        ? `with the barometric ${formatPlain(ctx.labels.barometricPressurePsia)} psia added, the absolute pressure must be above zero.`
        : "pressures are absolute and must be above zero.",
    );
  if (!(tc > ABSOLUTE_ZERO_F))
    throw badPoint(
      i,
      "temperature",
      t,
      ctx,
      "that is at or below absolute zero.",
    );
  ps[i] = pc;
  ts[i] = tc;
}

function checkCount(count: number): void {
  if (count > MAX_LOOKUP_POINTS) {
    throw new LookupError(
      "TOO_MANY_POINTS",
      `${count} points were sent; one lookup takes at most ${MAX_LOOKUP_POINTS}.`,
      {
        count,
        max: MAX_LOOKUP_POINTS,
      },
    );
  }
}

const NOT_POINTS =
  "Points must be a list of { pressure, temperature } or columns { pressures, temperatures } (number lists or Float64Array).";

/** Converts the caller's points to canonical typed arrays, checking each. */
function canonicalPoints(
  points: LookupPoints,
  ctx: UnitContext,
): { ps: Float64Array; ts: Float64Array } {
  if (Array.isArray(points)) {
    const list = points as readonly unknown[];
    const count = list.length;
    checkCount(count);
    const ps = new Float64Array(count);
    const ts = new Float64Array(count);
    for (let i = 0; i < count; i++) {
      const pt = list[i];
      if (typeof pt !== "object" || pt === null) {
        throw new LookupError(
          "INVALID_POINTS",
          `Point ${i + 1} must be an object { pressure, temperature }; got ${describe(pt)}.`,
          {
            pointIndex: i,
          },
        );
      }
      checkedPoint(
        i,
        (pt as LookupPoint).pressure,
        (pt as LookupPoint).temperature,
        ctx,
        ps,
        ts,
      );
    }
    return { ps, ts };
  }
  if (typeof points !== "object" || points === null)
    throw new LookupError("INVALID_POINTS", NOT_POINTS);
  const pc: unknown = (points as LookupPointColumns).pressures;
  const tc: unknown = (points as LookupPointColumns).temperatures;
  const ok = (c: unknown): c is Float64Array | readonly number[] =>
    c instanceof Float64Array || Array.isArray(c);
  if (!ok(pc) || !ok(tc)) throw new LookupError("INVALID_POINTS", NOT_POINTS);
  if (pc.length !== tc.length) {
    throw new LookupError(
      "INVALID_POINTS",
      `pressures has ${pc.length} entries but temperatures has ${tc.length}; they must pair up.`,
      {
        pressures: pc.length,
        temperatures: tc.length,
      },
    );
  }
  const count = pc.length;
  checkCount(count);
  const ps = new Float64Array(count);
  const ts = new Float64Array(count);
  for (let i = 0; i < count; i++) checkedPoint(i, pc[i], tc[i], ctx, ps, ts);
  return { ps, ts };
}

function back(a: Affine, canonical: number): number {
  return (canonical - a.offset) / a.scale;
}

/**
 * Re-expresses an engine error in the caller's units and with the lookup's codes. Messages count points
 * from 1 ("Point 3" is the third point sent); `details.pointIndex` stays 0-based.
 */
export function toLookupError(
  error: unknown,
  property: PropertyKey,
  ctx: UnitContext,
): unknown {
  if (!(error instanceof InterpolationError)) return error;
  const d = error.details;
  const index = typeof d.pointIndex === "number" ? d.pointIndex : undefined;
  const pUnit = ctx.labels.pressure.symbol;
  const tUnit = ctx.labels.temperature.symbol;
  const engineMessage = `${error.message} (numbers in psia and °F)`;
  const where = index === undefined ? "The point" : `Point ${index + 1}`;
  switch (error.code) {
    case "out-of-range":
    case "extrapolation-too-far": {
      const axis = d.axis === "temperature" ? "temperature" : "pressure";
      const a = axis === "pressure" ? ctx.pressure : ctx.temperature;
      const unit = axis === "pressure" ? pUnit : tUnit;
      const value = back(a, Number(d.value));
      const min = back(a, Number(d.min));
      const max = back(a, Number(d.max));
      // the value gets the digits it needs to differ in print from the range it is outside
      const v = formatApart(value, [min, max]);
      const range =
        min === max
          ? `the table of ${PROPERTIES[property].phrase} was measured at a single ${axis}, ${formatPlain(min)} ${unit}`
          : `the measured ${axis}s of ${PROPERTIES[property].phrase} run from ${formatPlain(min)} to ${formatPlain(max)} ${unit}`;
      if (error.code === "extrapolation-too-far") {
        const fraction = Number(d.maxExtrapolation);
        const limit = Math.abs(Number(d.limit) / a.scale);
        const distance = value < min ? min - value : value - max;
        return new LookupError(
          "EXTRAPOLATION_TOO_FAR",
          `${where} has ${axis} ${v} ${unit}, ${formatApart(distance, [limit])} ${unit} outside the measured range (${range}): farther than the extrapolation limit of ${formatApart(limit, [distance])} ${unit} (${formatPlain(fraction * 100)} % of the measured span). An extrapolated value so far from the data would be a guess; choose a point nearer the measured range or raise maxExtrapolation.`,
          {
            pointIndex: index,
            axis,
            value,
            min,
            max,
            unit,
            limit,
            maxExtrapolation: fraction,
            engineMessage,
          },
          error,
        );
      }
      return new LookupError(
        "OUT_OF_RANGE",
        `${where} has ${axis} ${v} ${unit}, outside the measured range: ${range}. Allow extrapolation to get a value anyway; it is then marked 'extrapolated'.`,
        { pointIndex: index, axis, value, min, max, unit, engineMessage },
        error,
      );
    }
    case "no-valid-zone": {
      const p = back(ctx.pressure, Number(d.pressure));
      const t = back(ctx.temperature, Number(d.temperature));
      const branch =
        d.branch === "saturated" || d.branch === "undersaturated"
          ? ` on the ${d.branch} branch`
          : "";
      return new LookupError(
        "NO_VALID_ZONE",
        `${where} (${formatPlain(p)} ${pUnit}, ${formatPlain(t)} ${tUnit}): no measured values of ${PROPERTIES[property].phrase} surround it${branch}. Cells around it were not measured, or it lies beyond the last measured pressure of the neighbouring temperatures. Allow extrapolation to get a value from the nearest measured values; it is then marked 'extrapolated'.`,
        {
          pointIndex: index,
          pressure: p,
          temperature: t,
          branch: d.branch,
          engineMessage,
        },
        error,
      );
    }
    case "invalid-point":
      return new LookupError("INVALID_POINT", error.message, { ...d }, error);
    case "invalid-options":
      return new LookupError("INVALID_OPTIONS", error.message, { ...d }, error);
    default:
      return new LookupError(
        "INVALID_GRID",
        `The stored table of ${PROPERTIES[property].phrase} cannot be used: ${error.message}`,
        { ...d, engineCode: error.code },
        error,
      );
  }
}

function canonicalOptions(opts: NormalizedLookupOptions) {
  return {
    method: opts.method,
    degree: opts.degree,
    extrapolate: opts.extrapolate,
    maxExtrapolation: opts.maxExtrapolation,
    property: opts.property,
  };
}

function prepare(grid: Grid, points: LookupPoints, options: LookupOptions) {
  const opts = normalizeLookupOptions(options);
  const ctx = unitContext(opts.property, opts.units, opts.basis);
  const { ps, ts } = canonicalPoints(points, ctx);
  let raw: CanonicalLookup;
  try {
    raw = lookupCanonical(grid, ps, ts, canonicalOptions(opts));
  } catch (error) {
    throw toLookupError(error, opts.property, ctx);
  }
  return { opts, ctx, raw, ps, ts };
}

/**
 * The message of refused point i (code k of LOOKUP_REFUSAL_CODES, 1-based), numbers in the caller's
 * units, the point counted from 1. For the engine's refusals the point is interpolated again on its own
 * to learn the details (axis, range, branch); only refused points pay for that.
 */
function refusalMessage(
  grid: Grid,
  ps: Float64Array,
  ts: Float64Array,
  i: number,
  k: number,
  opts: NormalizedLookupOptions,
  ctx: UnitContext,
): string {
  const pUnit = ctx.labels.pressure.symbol;
  const tUnit = ctx.labels.temperature.symbol;
  const at = `Point ${i + 1} (${formatPlain(back(ctx.pressure, ps[i]!))} ${pUnit}, ${formatPlain(back(ctx.temperature, ts[i]!))} ${tUnit})`;
  const phrase = PROPERTIES[opts.property].phrase;
  if (k === REFUSED_IMPOSSIBLE) {
    const limit = PHYSICAL_LIMITS[opts.property];
    // the value itself is not kept (NaN): computed again, unjudged, for the message
    const value = lookupCanonical(
      grid,
      ps.subarray(i, i + 1),
      ts.subarray(i, i + 1),
      { ...canonicalOptions(opts), property: undefined },
    ).values[0]!;
    const shown = Number.isFinite(value)
      ? ` comes out at ${formatPlain(back(ctx.value, value))} ${ctx.labels.value.symbol}, which`
      : "";
    return `${at}: the interpolated ${phrase}${shown} is physically impossible (${limit.rule}), so no value is given. This happens when a point lies far from the measured values (an extrapolation) or where the table changes steeply; choose a point nearer the measured data.`;
  }
  const error = engineRefusal(
    grid,
    ps[i]!,
    ts[i]!,
    engineOptions(canonicalOptions(opts)),
    i,
  );
  const mapped = error ? toLookupError(error, opts.property, ctx) : null;
  if (mapped instanceof LookupError) return mapped.message;
  return `${at}: no value of ${phrase} can be given here (${refusalCode(k)}).`;
}

function header(opts: NormalizedLookupOptions, ctx: UnitContext) {
  const degree: [number, number] | null =
    opts.method === "pchip" ? null : opts.degree;
  return {
    property: opts.property,
    method: opts.method,
    degree,
    methodDescription: describeLookupMethod(opts.method, opts.degree),
    extrapolate: opts.extrapolate,
    units: ctx.labels,
  };
}

/** Messages of the refused points, refusedCount and refusalCounts; null messages when none is refused. */
function refusalsOf(
  grid: Grid,
  raw: CanonicalLookup,
  ps: Float64Array,
  ts: Float64Array,
  opts: NormalizedLookupOptions,
  ctx: UnitContext,
): {
  messages: (string | undefined)[] | null;
  refusedCount: number;
  refusalCounts: Partial<Record<LookupRefusalCode, number>>;
} {
  const refusals = raw.refusals;
  const refusalCounts: Partial<Record<LookupRefusalCode, number>> = {};
  if (!refusals) return { messages: null, refusedCount: 0, refusalCounts };
  const messages = new Array<string | undefined>(raw.count);
  let refusedCount = 0;
  for (let i = 0; i < raw.count; i++) {
    const k = refusals[i]!;
    if (k === 0) continue;
    refusedCount++;
    const code = refusalCode(k);
    refusalCounts[code] = (refusalCounts[code] ?? 0) + 1;
    messages[i] = refusalMessage(grid, ps, ts, i, k, opts, ctx);
  }
  return { messages, refusedCount, refusalCounts };
}

/**
 * Interpolates `property` of a canonical grid at points given in the caller's unit system and returns one
 * result per point in that system. A point that cannot be served is refused in place (value null,
 * `refused: { code, message }`); the others are answered. Throws LookupError (codes in errors.ts) only for
 * bad options or points (not numbers, pressure not above zero absolute, below absolute zero), too many
 * points, or an unusable grid.
 */
export function runLookup(
  grid: Grid,
  points: LookupPoints,
  options: LookupOptions,
): LookupResult {
  const { opts, ctx, raw, ps: cps, ts: cts } = prepare(grid, points, options);
  const n = raw.count;
  const va = ctx.value;
  const vScale = Math.abs(va.scale);
  const pa = ctx.pressure;
  const ta = ctx.temperature;
  const P = grid.pressures;
  const T = grid.temperatures;
  const stencils = new Map<number, LookupStencil>();
  const exactStencils = new Map<string, LookupStencil>();
  // with missing cells or bubble points a column may use its own rows: the batch gives only the span,
  // so each point's exact cells are asked of the engine (only on such grids)
  const exactCells = needsExactCells(grid);
  const methodCounts: Record<UsedMethod, number> = {
    newton: 0,
    pchip: 0,
    linear: 0,
  };
  const flagCounts = new Map<number, number>();
  const results: LookupPointResult[] = new Array<LookupPointResult>(n);
  const {
    values,
    errorEstimates,
    flags,
    methods,
    branches,
    bubblePoints,
    alternatives,
    alternativeErrors,
    refusals,
  } = raw;
  const refused = refusalsOf(grid, raw, cps, cts, opts, ctx);
  for (let i = 0; i < n; i++) {
    const branch = branches
      ? branches[i] === 1
        ? "saturated"
        : branches[i] === 2
          ? "undersaturated"
          : null
      : null;
    const bubblePointPressure = bubblePoints
      ? (bubblePoints[i]! - pa.offset) / pa.scale
      : null;
    const k = refusals ? refusals[i]! : 0;
    if (k !== 0) {
      results[i] = {
        value: null,
        errorEstimate: null,
        warnings: NO_WARNINGS,
        method: null,
        stencil: null,
        branch,
        bubblePointPressure,
        refused: { code: refusalCode(k), message: refused.messages![i]! },
      };
      continue;
    }
    let stencil: LookupStencil | undefined;
    const exact = exactCells
      ? exactStencil(grid, cps[i]!, cts[i]!, methods[i]!, flags[i]!, opts)
      : null;
    if (exact) {
      const key = stencilKey(exact);
      stencil = exactStencils.get(key);
      if (!stencil) {
        stencil = toLookupStencil(exact, P, T, pa, ta);
        exactStencils.set(key, stencil);
      }
    } else {
      const ps = raw.pressureStart[i]!;
      const pc = raw.pressureCount[i]!;
      const tsI = raw.temperatureStart[i]!;
      const tc = raw.temperatureCount[i]!;
      const key = ((ps * 256 + pc) * 65536 + tsI) * 256 + tc;
      stencil = stencils.get(key);
      if (!stencil) {
        const pressure = span(ps, pc);
        const temperature = span(tsI, tc);
        stencil = toLookupStencil(
          {
            pressure,
            temperature,
            columns: temperature.map((j) => ({ temperature: j, pressure })),
          },
          P,
          T,
          pa,
          ta,
        );
        stencils.set(key, stencil);
      }
    }
    const f = flags[i]!;
    const expanded = expandWarningFlags(f);
    if (f !== 0) flagCounts.set(f, (flagCounts.get(f) ?? 0) + 1);
    const method = METHOD_CODES[methods[i]!]!;
    methodCounts[method]++;
    const e = errorEstimates[i]!;
    const result: LookupPointResult = {
      value: (values[i]! - va.offset) / va.scale,
      // NaN from the engine: the table says nothing about the error here
      errorEstimate: Number.isNaN(e) ? null : e * (1 / vScale),
      warnings: expanded.warnings,
      method,
      stencil,
      branch,
      bubblePointPressure,
    };
    if (opts.messages && f !== 0) result.messages = expanded.messages;
    if (alternatives && !Number.isNaN(alternatives[i]!)) {
      const ae = alternativeErrors![i]!;
      result.alternative = {
        method: "pchip",
        value: (alternatives[i]! - va.offset) / va.scale,
        errorEstimate: ae / vScale,
      };
    }
    results[i] = result;
  }
  const warningCounts: Partial<Record<LookupWarning, number>> = {};
  for (const [f, c] of flagCounts) {
    for (const code of expandWarningFlags(f).warnings)
      warningCounts[code] = (warningCounts[code] ?? 0) + c;
  }
  return {
    ...header(opts, ctx),
    results,
    summary: {
      count: n,
      methodCounts,
      warningCounts,
      refusedCount: refused.refusedCount,
      refusalCounts: refused.refusalCounts,
    },
  };
}

const NO_WARNINGS: readonly LookupWarning[] = Object.freeze([]);

function span(start: number, count: number): number[] {
  const out = new Array<number>(count);
  for (let k = 0; k < count; k++) out[k] = start + k;
  return out;
}

/** Whether the batch's stencil spans can differ from the exact cells: missing cells or bubble points. */
function needsExactCells(grid: Grid): boolean {
  if (grid.bubblePoints?.some((b) => b !== null && b !== undefined))
    return true;
  for (const row of grid.values)
    for (const v of row) if (v === null || v === undefined) return true;
  return false;
}

/**
 * The engine's exact stencil of one served point, computed as the batch computed its value (the method
 * used; the pchip fallback as lookupCanonical runs it). Null if the engine unexpectedly refuses it.
 */
function exactStencil(
  grid: Grid,
  p: number,
  t: number,
  methodCode: number,
  flags: number,
  opts: NormalizedLookupOptions,
): Stencil | null {
  const method = METHOD_CODES[methodCode]!;
  const fallback = (flags & W_PCHIP_FALLBACK) !== 0;
  try {
    return interpolateGrid(
      grid,
      { pressure: p, temperature: t },
      fallback
        ? { method: "pchip", extrapolate: true, maxExtrapolation: Infinity }
        : {
            method,
            degree: opts.degree,
            extrapolate: opts.extrapolate,
            maxExtrapolation: opts.maxExtrapolation,
          },
    ).stencil;
  } catch {
    return null;
  }
}

function stencilKey(s: Stencil): string {
  let key = "";
  for (const c of s.columns)
    key += `${c.temperature}${c.bubblePointNode ? "b" : ""}:${c.pressure.join(",")};`;
  return key;
}

function toLookupStencil(
  s: Stencil,
  P: readonly number[],
  T: readonly number[],
  pa: Affine,
  ta: Affine,
): LookupStencil {
  const pOut = (i: number) => (P[i]! - pa.offset) / pa.scale;
  const tOut = (j: number) => (T[j]! - ta.offset) / ta.scale;
  const rowsOf = new Map<number[], readonly number[]>();
  const columns = s.columns.map((c) => {
    let pressures = rowsOf.get(c.pressure);
    if (!pressures) {
      pressures = Object.freeze(c.pressure.map(pOut));
      rowsOf.set(c.pressure, pressures);
    }
    const column: LookupStencilColumn = {
      temperatureIndex: c.temperature,
      temperature: tOut(c.temperature),
      pressureIndices: Object.freeze([...c.pressure]),
      pressures,
      ...(c.bubblePointNode ? { bubblePointNode: true as const } : {}),
    };
    return Object.freeze(column);
  });
  return Object.freeze({
    pressureIndices: Object.freeze([...s.pressure]),
    temperatureIndices: Object.freeze([...s.temperature]),
    pressures: Object.freeze(s.pressure.map(pOut)),
    temperatures: Object.freeze(s.temperature.map(tOut)),
    columns: Object.freeze(columns),
  });
}

/** Summary counts of a columns result (served points' methods and warnings). */
function columnsSummary(
  raw: CanonicalLookup,
  refused: ReturnType<typeof refusalsOf>,
): LookupSummary {
  const methodCounts: Record<UsedMethod, number> = {
    newton: 0,
    pchip: 0,
    linear: 0,
  };
  const flagCounts = new Map<number, number>();
  const refusals = raw.refusals;
  for (let i = 0; i < raw.count; i++) {
    if (refusals && refusals[i] !== 0) continue;
    methodCounts[METHOD_CODES[raw.methods[i]!]!]++;
    const f = raw.flags[i]!;
    if (f !== 0) flagCounts.set(f, (flagCounts.get(f) ?? 0) + 1);
  }
  const warningCounts: Partial<Record<LookupWarning, number>> = {};
  for (const [f, c] of flagCounts)
    for (const code of expandWarningFlags(f).warnings)
      warningCounts[code] = (warningCounts[code] ?? 0) + c;
  return {
    count: raw.count,
    methodCounts,
    warningCounts,
    refusedCount: refused.refusedCount,
    refusalCounts: refused.refusalCounts,
  };
}

/**
 * As runLookup, but returns typed arrays instead of an object per point (plots, very large batches).
 * Values, error estimates and bubble points are in the output units; warnings are bit masks; refused points
 * have NaN values and a code in `refusals`.
 */
export function runLookupColumns(
  grid: Grid,
  points: LookupPoints,
  options: LookupOptions,
): LookupColumnsResult {
  const { opts, ctx, raw, ps, ts } = prepare(grid, points, options);
  const n = raw.count;
  const va = ctx.value;
  const vScale = Math.abs(va.scale);
  const pa = ctx.pressure;
  const {
    values,
    errorEstimates,
    bubblePoints,
    alternatives,
    alternativeErrors,
  } = raw;
  const refused = refusalsOf(grid, raw, ps, ts, opts, ctx);
  const summary = columnsSummary(raw, refused);
  for (let i = 0; i < n; i++) {
    values[i] = (values[i]! - va.offset) / va.scale;
    errorEstimates[i] = errorEstimates[i]! / vScale;
  }
  if (bubblePoints)
    for (let i = 0; i < n; i++)
      bubblePoints[i] = (bubblePoints[i]! - pa.offset) / pa.scale;
  if (alternatives && alternativeErrors) {
    for (let i = 0; i < n; i++) {
      alternatives[i] = (alternatives[i]! - va.offset) / va.scale;
      alternativeErrors[i] = alternativeErrors[i]! / vScale;
    }
  }
  return {
    ...header(opts, ctx),
    count: n,
    values,
    errorEstimates,
    warnings: raw.flags,
    methods: raw.methods,
    branches: raw.branches,
    bubblePointPressures: bubblePoints,
    alternatives,
    alternativeErrors,
    pressureStart: raw.pressureStart,
    pressureCount: raw.pressureCount,
    temperatureStart: raw.temperatureStart,
    temperatureCount: raw.temperatureCount,
    refusals: raw.refusals,
    refusalMessages: refused.messages,
    summary,
  };
}
