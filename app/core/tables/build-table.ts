/**
 * A black-oil style table at one temperature, resampled on requested pressures, in canonical units
 * (psia, °F, scf/STB, rb/STB, rb/scf, cP). The bubble-point pressure at that temperature gets its own row;
 * every value is interpolated with the lookup's method, then the columns are put in the order simulators
 * need, and every value that had to change for that is recorded as a correction.
 */
import type { Branch, Grid } from "../interpolation";
import {
  bubblePointsAt,
  describeLookupMethod,
  engineOptions,
  engineRefusal,
  expandWarningFlags,
  isLookupError,
  lookupCanonical,
  METHOD_CODES,
  normalizeLookupOptions,
  refusalCode,
  toLookupError,
  unitContext,
  type LookupMethod,
  type UnitBasis,
  type LookupWarning,
  type UsedMethod,
} from "../lookup";
import type { OutputSystem, PropertyKey } from "../units";
import {
  COLUMN_INFO,
  OIL_COLUMNS,
  TABLE_COLUMNS,
  type TableColumnKey,
} from "./columns";
import { TableError } from "./errors";
import { enforceDecreasing, enforceIncreasing, makePositive } from "./order";
import { MAX_TABLE_ROWS } from "./pressure-spec";
import { formatPlain } from "../format";

export type BlackOilTableInput = {
  /** Canonical grids; the table has a column for each of solution_gor, oil_fvf, oil_viscosity, gas_fvf, gas_viscosity, z_factor given. */
  grids: Partial<Record<PropertyKey, Grid>>;
  /** °F. */
  temperature: number;
  /** psia, strictly increasing, at most MAX_TABLE_ROWS. */
  pressures: readonly number[];
  method: LookupMethod;
  degree?: number | [number, number];
  extrapolate?: boolean;
  /** Unit system of the numbers in error messages (default field); the table itself is canonical. */
  messageUnits?: OutputSystem;
  /** Pressures in error messages absolute (default) or gauge, with the sample's barometric pressure. */
  messageBasis?: Pick<UnitBasis, "pressureBasis" | "barometricPressurePsia">;
};

export type TableCell = {
  /** Canonical unit of the column; after any correction. */
  value: number;
  /**
   * The engine's estimate, plus the size of the correction where the value was corrected; null where the
   * table says nothing about the error (warning estimate-unavailable).
   */
  errorEstimate: number | null;
  /** The interpolated value before any correction. */
  interpolated: number;
  method: UsedMethod;
  warnings: readonly LookupWarning[];
  corrected: boolean;
};

export type TableRow = {
  /** psia. */
  pressure: number;
  /** saturated at and below the bubble point, undersaturated above; null in a table without oil columns. */
  branch: Branch | null;
  /** The row at the bubble-point pressure. */
  bubblePoint: boolean;
  /** false for the bubble-point row when it was added to the requested pressures. */
  requested: boolean;
  cells: Partial<Record<TableColumnKey, TableCell>>;
};

/** The order rules a correction restores. */
export type TableRule =
  | "positive"
  | "rs-non-negative"
  | "rs-equals-rsb"
  | "rs-increasing-below-pb"
  | "bo-increasing-below-pb"
  | "bo-decreasing-above-pb"
  | "bg-decreasing";

export const TABLE_RULE_TEXT: Readonly<Record<TableRule, string>> =
  Object.freeze({
    positive:
      "this property must be positive; the value was replaced by interpolating between the nearest positive values in pressure",
    "rs-non-negative": "Rs cannot be negative; the value was set to 0",
    "rs-equals-rsb":
      "at and above the bubble point no more gas dissolves, so Rs equals its bubble-point value Rsb",
    "rs-increasing-below-pb":
      "below the bubble point Rs must rise with pressure, up to Rsb at the bubble point",
    "bo-increasing-below-pb":
      "below the bubble point Bo must rise with pressure, up to its maximum at the bubble point",
    "bo-decreasing-above-pb":
      "above the bubble point Bo must fall with pressure (the oil's compressibility is positive)",
    "bg-decreasing": "Bg must fall with pressure",
  });

const ORDER_RULES: readonly TableRule[] = [
  "rs-increasing-below-pb",
  "bo-increasing-below-pb",
  "bo-decreasing-above-pb",
  "bg-decreasing",
];

/** Plain words for one correction; `where` names the row, e.g. "3000 psia". */
export function correctionReason(
  column: TableColumnKey,
  where: string,
  rules: readonly TableRule[],
): string {
  const why = rules.map((r) => TABLE_RULE_TEXT[r]).join("; ");
  const how = rules.some((r) => ORDER_RULES.includes(r))
    ? " The nearest values in the required order were used (least squares), with a small slope where that left equal values."
    : "";
  return `${COLUMN_INFO[column].name} at ${where}: ${why}.${how}`;
}

export type TableCorrection = {
  /** Row index in `rows`. */
  row: number;
  /** psia. */
  pressure: number;
  column: TableColumnKey;
  /** Interpolated value (canonical unit of the column). */
  original: number;
  corrected: number;
  rules: TableRule[];
  /** Plain words. */
  reason: string;
  /** The change is no larger than the interpolated value's own error estimate. */
  withinErrorEstimate: boolean;
};

export type TableNoteCode =
  | "bubble-points-differ"
  | "rows-not-computable"
  | "bubble-point-row-omitted"
  | "extrapolated-values"
  | "pchip-fallback"
  | "corrections";

export type TableNote = { code: TableNoteCode; message: string };

export type BlackOilTable = {
  /** °F. */
  temperature: number;
  /** psia at `temperature`; null without oil columns. */
  bubblePointPressure: number | null;
  /** Rs at and above the bubble point (scf/STB); null without an Rs column or when no row reaches pb. */
  solutionGorAtBubblePoint: number | null;
  method: LookupMethod;
  degree: [number, number] | null;
  methodDescription: string;
  extrapolate: boolean;
  /** The columns present, left to right (pressure comes first and is not listed). */
  columns: TableColumnKey[];
  rows: TableRow[];
  corrections: TableCorrection[];
  notes: TableNote[];
};

const ABSOLUTE_ZERO_F = -459.67;

function toTableError(
  error: unknown,
  column: TableColumnKey,
  units: OutputSystem,
  rowsP: readonly number[],
  basis: UnitBasis = {},
): unknown {
  const mapped = toLookupError(
    error,
    column,
    unitContext(column, units, basis),
  );
  if (!isLookupError(mapped)) return mapped;
  const name = COLUMN_INFO[column].name;
  const d = mapped.details;
  const row = typeof d.pointIndex === "number" ? d.pointIndex : undefined;
  const details = {
    ...d,
    column,
    row,
    pressurePsia: row === undefined ? undefined : rowsP[row],
  };
  switch (mapped.code) {
    case "OUT_OF_RANGE":
      return new TableError(
        "OUT_OF_RANGE",
        `The ${String(d.axis)} ${formatPlain(Number(d.value))} ${String(d.unit)} lies outside the measured range of ${name}, ${formatPlain(Number(d.min))} to ${formatPlain(Number(d.max))} ${String(d.unit)}. Choose ${d.axis === "temperature" ? "a temperature" : "pressures"} inside it, or allow extrapolation (extrapolated values are marked).`,
        details,
        mapped,
      );
    case "NO_VALID_ZONE":
      return new TableError(
        "NO_VALID_ZONE",
        `${name}: ${mapped.message}`,
        details,
        mapped,
      );
    case "INVALID_OPTIONS":
      return new TableError("INVALID_OPTIONS", mapped.message, details, mapped);
    default:
      return new TableError(
        "INVALID_GRID",
        `${name}: ${mapped.message}`,
        details,
        mapped,
      );
  }
}

function checkInput(input: BlackOilTableInput): void {
  if (typeof input !== "object" || input === null) {
    throw new TableError(
      "INVALID_OPTIONS",
      "Table input is required: { grids, temperature, pressures, method }.",
    );
  }
  if (typeof input.grids !== "object" || input.grids === null) {
    throw new TableError(
      "INVALID_OPTIONS",
      "grids must be an object of property grids, e.g. { oil_fvf, solution_gor, oil_viscosity }.",
    );
  }
  const t: unknown = input.temperature;
  if (typeof t !== "number" || !Number.isFinite(t) || t <= ABSOLUTE_ZERO_F) {
    throw new TableError(
      "INVALID_OPTIONS",
      `The temperature is ${String(t)} °F; a finite temperature above absolute zero is needed.`,
      {
        field: "temperature",
      },
    );
  }
  const ps: unknown = input.pressures;
  if (!Array.isArray(ps) || ps.length === 0) {
    throw new TableError(
      "MALFORMED_PRESSURES",
      "At least one pressure is needed.",
      { field: "pressures" },
    );
  }
  if (ps.length > MAX_TABLE_ROWS) {
    throw new TableError(
      "TOO_MANY_ROWS",
      `${ps.length} pressures were asked for; a table has at most ${MAX_TABLE_ROWS} rows.`,
      {
        count: ps.length,
        max: MAX_TABLE_ROWS,
      },
    );
  }
  for (let i = 0; i < ps.length; i++) {
    const p: unknown = ps[i];
    if (typeof p !== "number" || !Number.isFinite(p)) {
      throw new TableError(
        "NOT_FINITE",
        `Pressure ${i + 1} is ${String(p)}; pressures must be finite numbers.`,
        { index: i },
      );
    }
    if (!(p > 0))
      throw new TableError(
        "NOT_POSITIVE",
        `Pressure ${i + 1} is ${p} psia; pressures are absolute and must be above zero.`,
        { index: i },
      );
    if (i > 0 && !(p > (ps[i - 1] as number))) {
      throw new TableError(
        "NOT_INCREASING",
        `Pressures must be strictly increasing, but pressure ${i + 1} (${p} psia) follows ${String(ps[i - 1])} psia.`,
        {
          index: i,
        },
      );
    }
  }
}

function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

type Work = {
  values: number[];
  rules: (TableRule[] | undefined)[];
};

/** Applies fn to a copy of the slice [from, to) and records `rule` on every value it changed. */
function apply(
  w: Work,
  from: number,
  to: number,
  rule: TableRule,
  fn: (y: number[]) => void,
): void {
  if (to <= from) return;
  const y = w.values.slice(from, to);
  fn(y);
  for (let i = from; i < to; i++) {
    const v = y[i - from]!;
    if (v !== w.values[i]) {
      w.values[i] = v;
      const list = (w.rules[i] ??= []);
      if (!list.includes(rule)) list.push(rule);
    }
  }
}

function positive(w: Work, x: readonly number[], column: TableColumnKey): void {
  apply(w, 0, x.length, "positive", (y) => {
    if (!makePositive(x, y)) {
      throw new TableError(
        "NONPHYSICAL_COLUMN",
        `Every interpolated value of ${COLUMN_INFO[column].name} at this temperature is zero or negative; the column cannot be used.`,
        { column },
      );
    }
  });
}

/**
 * Builds the table (canonical units). Throws TableError for bad input, an oil grid without a bubble point,
 * or a row outside a grid's measured range (unless `extrapolate`).
 */
export function buildBlackOilTable(input: BlackOilTableInput): BlackOilTable {
  checkInput(input);
  const units: OutputSystem =
    input.messageUnits === "metric" ? "metric" : "field";
  let opts;
  try {
    opts = normalizeLookupOptions({
      method: input.method,
      degree: input.degree,
      extrapolate: input.extrapolate,
      property: "oil_fvf",
      units: "field",
    });
  } catch (error) {
    throw isLookupError(error)
      ? new TableError(
          "INVALID_OPTIONS",
          error.message,
          { ...error.details },
          error,
        )
      : error;
  }
  const grids = input.grids;
  const columns = TABLE_COLUMNS.filter(
    (k) => grids[k] !== undefined && grids[k] !== null,
  );
  if (columns.length === 0) {
    throw new TableError(
      "NO_GRIDS",
      `No grid for a table column was given; a table needs at least one of ${TABLE_COLUMNS.join(", ")}.`,
    );
  }
  const temperature = input.temperature;
  const engineMethod: UsedMethod =
    opts.method === "auto" ? "newton" : opts.method;
  const notes: TableNote[] = [];

  // the bubble point at this temperature, from the oil grids
  let pb: number | null = null;
  let pbFrom: TableColumnKey | null = null;
  for (const key of columns) {
    if (!OIL_COLUMNS.includes(key)) continue;
    let v: Float64Array | null;
    try {
      v = bubblePointsAt(
        grids[key]!,
        Float64Array.of(temperature),
        engineMethod,
        opts.degree[1],
      );
    } catch (error) {
      throw toTableError(error, key, units, [], input.messageBasis);
    }
    if (!v) {
      throw new TableError(
        "NO_BUBBLE_POINT",
        `The ${COLUMN_INFO[key].name} grid has no known bubble point, so saturated and undersaturated rows cannot be told apart. Record the bubble-point pressure of each temperature first.`,
        { column: key },
      );
    }
    const here = v[0]!;
    if (pb === null) {
      pb = here;
      pbFrom = key;
    } else if (Math.abs(here - pb) > 1e-6 * pb) {
      notes.push({
        code: "bubble-points-differ",
        message: `The ${COLUMN_INFO[key].name} grid puts the bubble point at ${formatPlain(here)} psia, the ${COLUMN_INFO[pbFrom!].name} grid at ${formatPlain(pb)} psia; the table uses ${formatPlain(pb)} psia. The grids should come from one sample revision.`,
      });
    }
  }

  if (pb !== null && !Number.isFinite(pb)) {
    throw new TableError(
      "NOT_COMPUTABLE",
      `The bubble point at ${formatPlain(temperature)} °F cannot be computed: extrapolating the measured bubble points does not give a finite pressure. Choose a temperature nearer the measured ones.`,
      { temperature },
    );
  }

  // rows: the requested pressures, and the bubble point as its own row
  let rowsP = [...input.pressures];
  let requested = rowsP.map(() => true);
  let pbRow = -1;
  if (pb !== null) {
    const inside = columns.every((k) => {
      const P = grids[k]!.pressures;
      return pb! >= P[0]! && pb! <= P[P.length - 1]!;
    });
    if (inside || opts.extrapolate) {
      const tol = 1e-9 * pb;
      let at = rowsP.findIndex((p) => p >= pb! - tol);
      if (at >= 0 && Math.abs(rowsP[at]! - pb) <= tol) {
        rowsP[at] = pb;
      } else {
        if (at < 0) at = rowsP.length;
        rowsP.splice(at, 0, pb);
        requested.splice(at, 0, false);
      }
      pbRow = at;
    } else {
      notes.push({
        code: "bubble-point-row-omitted",
        message: `The bubble point at this temperature, ${formatPlain(pb)} psia, lies outside the measured pressures, so the table has no row at the bubble point. Allow extrapolation to add it (it is then marked extrapolated).`,
      });
    }
  }
  let n = rowsP.length;
  let branches: (Branch | null)[] = rowsP.map((p) =>
    pb === null ? null : p <= pb ? "saturated" : "undersaturated",
  );
  // last saturated row
  let k = -1;
  for (let i = 0; i < n; i++) if (branches[i] === "saturated") k = i;

  // interpolate every column on every row
  const ps = Float64Array.from(rowsP);
  const ts = new Float64Array(n).fill(temperature);
  const raw = new Map<
    TableColumnKey,
    {
      values: number[];
      errors: Float64Array;
      flags: Uint16Array;
      methods: Uint8Array;
    }
  >();
  // The table keeps its own rules for values beyond the data (order corrections, Rs ≥ 0, positive values)
  // and extrapolates without the lookup's distance limit; a refused row (outside the range without
  // extrapolation, or no measured values around it) refuses the table with the engine's reason, as before.
  const canonical = {
    ...opts,
    maxExtrapolation: Infinity,
    property: undefined,
  };
  for (const key of columns) {
    try {
      const r = lookupCanonical(grids[key]!, ps, ts, canonical);
      const refused = r.refusals ? r.refusals.findIndex((k) => k !== 0) : -1;
      if (refused >= 0) {
        throw (
          engineRefusal(
            grids[key]!,
            ps[refused]!,
            ts[refused]!,
            engineOptions(canonical),
            refused,
          ) ??
          new Error(
            `Row ${refused + 1} of ${COLUMN_INFO[key].name} was refused (${refusalCode(r.refusals![refused]!)}) although the engine serves it on its own.`,
          )
        );
      }
      raw.set(key, {
        values: Array.from(r.values),
        errors: r.errorEstimates,
        flags: r.flags,
        methods: r.methods,
      });
    } catch (error) {
      throw toTableError(error, key, units, rowsP, input.messageBasis);
    }
  }

  // Rows that cannot be computed (a value NaN or ±Infinity, e.g. far beyond the measured data with
  // extrapolation allowed) are left out and named in a note: no non-finite number enters the table, its order
  // corrections or any output. An estimate the table cannot give (NaN: the engine's estimate-unavailable) is
  // null in the cell, never a small number.
  const bad = new Set<number>();
  for (const key of columns) {
    const r = raw.get(key)!;
    for (let i = 0; i < n; i++) if (!Number.isFinite(r.values[i]!)) bad.add(i);
  }
  if (bad.size === n) {
    throw new TableError(
      "NOT_COMPUTABLE",
      `No row of the table can be computed: interpolation does not give finite values at ${n === 1 ? "this pressure" : "these pressures"} and ${formatPlain(temperature)} °F (too far outside the measured data). Choose conditions nearer the measured range.`,
      { rows: n },
    );
  }
  if (bad.size > 0) {
    const keep = (_: unknown, i: number) => !bad.has(i);
    const omitted = [...bad].sort((a, b) => a - b).map((i) => rowsP[i]!);
    const shown = omitted
      .slice(0, 10)
      .map((p) => formatPlain(p))
      .join(", ");
    notes.push({
      code: "rows-not-computable",
      message: `${bad.size} row${bad.size === 1 ? "" : "s"} (at ${shown}${omitted.length > 10 ? ", …" : ""} psia) cannot be computed: interpolation does not give a finite value there (too far outside the measured data), so ${bad.size === 1 ? "it is" : "they are"} left out of the table.`,
    });
    for (const [key, r] of raw)
      raw.set(key, {
        values: r.values.filter(keep),
        errors: r.errors.filter(keep),
        flags: r.flags.filter(keep),
        methods: r.methods.filter(keep),
      });
    const pbIndex = pbRow;
    pbRow =
      pbIndex >= 0 && !bad.has(pbIndex)
        ? pbIndex - [...bad].filter((b) => b < pbIndex).length
        : -1;
    rowsP = rowsP.filter(keep);
    requested = requested.filter(keep);
    branches = branches.filter(keep);
    n = rowsP.length;
    k = -1;
    for (let i = 0; i < n; i++) if (branches[i] === "saturated") k = i;
  }

  // the order simulators need
  const work = new Map<TableColumnKey, Work>();
  for (const key of columns)
    work.set(key, {
      values: raw.get(key)!.values.slice(),
      rules: new Array(n),
    });
  let rsb: number | null = null;
  const rs = work.get("solution_gor");
  if (rs) {
    apply(rs, 0, n, "rs-non-negative", (y) => {
      for (let i = 0; i < y.length; i++) if (y[i]! < 0) y[i] = 0;
    });
    if (pb !== null) {
      if (k + 1 < n) rsb = median(rs.values.slice(k + 1));
      else if (pbRow >= 0) rsb = rs.values[pbRow]!;
      if (rsb !== null) {
        const value = rsb;
        const from = pbRow >= 0 ? pbRow : k + 1;
        apply(rs, from, n, "rs-equals-rsb", (y) => y.fill(value));
      }
    }
    apply(rs, 0, k + 1, "rs-increasing-below-pb", (y) =>
      enforceIncreasing(rowsP.slice(0, k + 1), y, {
        anchor: pbRow === k && k >= 0 ? k : null,
      }),
    );
    // a run that started at 0 may dip a hair below it: no gas dissolved is Rs = 0, repeated if need be
    apply(rs, 0, k + 1, "rs-non-negative", (y) => {
      for (let i = 0; i < y.length; i++) if (y[i]! < 0) y[i] = 0;
    });
  }
  const bo = work.get("oil_fvf");
  if (bo) {
    positive(bo, rowsP, "oil_fvf");
    apply(bo, 0, k + 1, "bo-increasing-below-pb", (y) =>
      enforceIncreasing(rowsP.slice(0, k + 1), y, {
        anchor: pbRow === k && k >= 0 ? k : null,
        lower: 0,
      }),
    );
    const from = pbRow >= 0 ? pbRow : k + 1;
    apply(bo, from, n, "bo-decreasing-above-pb", (y) =>
      enforceDecreasing(rowsP.slice(from), y, {
        anchor: pbRow >= 0 ? 0 : null,
        lower: 0,
      }),
    );
  }
  const bg = work.get("gas_fvf");
  if (bg) {
    positive(bg, rowsP, "gas_fvf");
    apply(bg, 0, n, "bg-decreasing", (y) =>
      enforceDecreasing(rowsP, y, { anchor: null, lower: 0 }),
    );
  }
  for (const key of ["oil_viscosity", "gas_viscosity", "z_factor"] as const) {
    const w = work.get(key);
    if (w) positive(w, rowsP, key);
  }

  // rows, cells and the record of corrections
  const rows: TableRow[] = rowsP.map((pressure, i) => ({
    pressure,
    branch: branches[i]!,
    bubblePoint: i === pbRow,
    requested: requested[i]!,
    cells: {},
  }));
  const corrections: TableCorrection[] = [];
  let extrapolated = 0;
  let fallbacks = 0;
  for (const key of columns) {
    const r = raw.get(key)!;
    const w = work.get(key)!;
    for (let i = 0; i < n; i++) {
      const original = r.values[i]!;
      const value = w.values[i]!;
      const delta = Math.abs(value - original);
      const warnings = expandWarningFlags(r.flags[i]!).warnings;
      if (warnings.includes("extrapolated")) extrapolated++;
      if (warnings.includes("pchip-fallback")) fallbacks++;
      const corrected = value !== original;
      rows[i]!.cells[key] = {
        value,
        errorEstimate: Number.isFinite(r.errors[i]!)
          ? r.errors[i]! + delta
          : null,
        interpolated: original,
        method: METHOD_CODES[r.methods[i]!]!,
        warnings,
        corrected,
      };
      if (corrected) {
        const rules = w.rules[i] ?? [];
        corrections.push({
          row: i,
          pressure: rowsP[i]!,
          column: key,
          original,
          corrected: value,
          rules,
          reason: correctionReason(
            key,
            `${formatPlain(rowsP[i]!)} psia`,
            rules,
          ),
          withinErrorEstimate: delta <= r.errors[i]!,
        });
      }
    }
  }
  corrections.sort(
    (a, b) =>
      a.row - b.row ||
      TABLE_COLUMNS.indexOf(a.column) - TABLE_COLUMNS.indexOf(b.column),
  );
  if (extrapolated > 0) {
    notes.push({
      code: "extrapolated-values",
      message: `${extrapolated} value${extrapolated === 1 ? " is" : "s are"} extrapolated beyond the measured data; treat ${extrapolated === 1 ? "it" : "them"} with suspicion.`,
    });
  }
  if (fallbacks > 0) {
    notes.push({
      code: "pchip-fallback",
      message: `At ${fallbacks} value${fallbacks === 1 ? "" : "s"} Newton interpolation overshot the measured values, and the shape-preserving (pchip) value was used instead.`,
    });
  }
  if (corrections.length > 0) {
    const per = columns
      .map(
        (key) =>
          [key, corrections.filter((c) => c.column === key).length] as const,
      )
      .filter(([, c]) => c > 0)
      .map(([key, c]) => `${COLUMN_INFO[key].name} ${c}`)
      .join(", ");
    notes.push({
      code: "corrections",
      message: `${corrections.length} value${corrections.length === 1 ? " was" : "s were"} corrected to keep the order simulators need (${per}); each is listed with its interpolated value.`,
    });
  }
  return {
    temperature,
    bubblePointPressure: pb,
    solutionGorAtBubblePoint: rs ? rsb : null,
    method: opts.method,
    degree: opts.method === "pchip" ? null : opts.degree,
    methodDescription: describeLookupMethod(opts.method, opts.degree),
    extrapolate: opts.extrapolate,
    columns,
    rows,
    corrections,
    notes,
  };
}
