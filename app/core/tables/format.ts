/**
 * A black-oil table in the caller's unit system, as JSON (a plain object), CSV or our own plain text layout.
 * All three carry the same numbers: each value is converted once and rounded once (7 significant digits,
 * more where a column needs them to keep neighbouring rows apart), and CSV and text print exactly that
 * number, so parsing any of them gives back the JSON values.
 */
import type { Branch } from "../interpolation";
import {
  affineToCanonical,
  fromCanonicalWith,
  type Affine,
  type LookupMethod,
  type LookupWarning,
} from "../lookup";
import {
  CANONICAL_UNIT_SYSTEM,
  DEFAULT_SAMPLE_BAROMETRIC_PSIA,
  gasVolumeRebaseFactor,
  OUTPUT_SYSTEMS,
  outputPressureUnit,
  outputUnitSystem,
  standardConditionsLabel,
  type PressureBasis,
  type ReferenceConditions,
  type OutputSystem,
  PROPERTY_QUANTITIES,
  type Quantity,
  type StandardConditions,
  type UnitSystem,
} from "../units";
import type { BlackOilTable, TableNote, TableRule } from "./build-table";
import { correctionReason, TABLE_RULE_TEXT } from "./build-table";
import { COLUMN_INFO, type TableColumnKey } from "./columns";
import { csvCell } from "../csv";
import { TableError } from "./errors";
import { formatDecimals, roundSignificant } from "../format";

export type TableFormatOptions = {
  units: OutputSystem;
  /** How the sample is named to people (field, well, sample id). */
  sampleLabel: string;
  /** The sample revision the grids came from. */
  revision: number;
  generatedAt: Date | string;
  /**
   * Reference conditions of the gas volumes in Rs and Bg. Default: those of the unit system (60 °F and
   * 14.696 psia for field, 15 °C and 101.325 kPa for metric); another base re-expresses Rs and Bg on it.
   */
  standardConditions?: StandardConditions;
  /**
   * Standard conditions the stored Rs and Bg are on: the sample's (its report's). Default 60 °F, 14.696 psia.
   * They are rebased from these to `standardConditions`.
   */
  reportStandardConditions?: ReferenceConditions;
  /** Pressures absolute (default) or gauge (psig in field, barg in metric units). */
  pressureBasis?: PressureBasis;
  /** Barometric pressure of gauge pressures, psia (the sample's); default 14.696. */
  barometricPressurePsia?: number;
};

/** The caution printed with every table (the app's footer caution). */
export const TABLE_CAUTION =
  "Interpolated and extrapolated properties are estimates. Check them against the laboratory report, and follow local regulations and licensed engineering practice for well control, facility design and reserves.";

/** Significant digits of every value unless a column needs more to keep neighbouring rows apart. */
export const BASE_DIGITS = 7;
const MAX_DIGITS = 17;
/** Error estimates carry two significant digits (the format module's rule). */
const ERROR_DIGITS = 2;

/** Plain ASCII unit labels for CSV headers and the text layout (the catalogue ids, except temperatures). */
function asciiUnit(id: string): string {
  if (id === "degF") return "deg F";
  if (id === "degC") return "deg C";
  return id;
}

const POW10 = Array.from({ length: 23 }, (_, k) => 10 ** k);

/**
 * x rounded to `digits` significant digits, as the double nearest to that decimal (so String() prints
 * it short). An integer divided (or multiplied) by an exact power of ten is correctly rounded in IEEE
 * arithmetic; a tie may round either way, and every format uses this one function, so they agree.
 */
function roundTo(x: number, digits: number): number {
  if (x === 0 || !Number.isFinite(x)) return x === 0 ? 0 : x;
  const k = digits - 1 - Math.floor(Math.log10(Math.abs(x)));
  if (k > 22 || k < -22) return roundSignificant(x, digits);
  return k >= 0
    ? Math.round(x * POW10[k]!) / POW10[k]!
    : Math.round(x / POW10[-k]!) * POW10[-k]!;
}

/** The fewest digits (≥ BASE_DIGITS) that keep every pair of different neighbours different. */
function digitsFor(values: readonly number[]): number {
  for (let d = BASE_DIGITS; d < MAX_DIGITS; d++) {
    let ok = true;
    for (let i = 1; i < values.length && ok; i++) {
      if (
        values[i] !== values[i - 1] &&
        roundTo(values[i]!, d) === roundTo(values[i - 1]!, d)
      )
        ok = false;
    }
    if (ok) return d;
  }
  return MAX_DIGITS;
}

type OutColumn = {
  key: "pressure" | TableColumnKey;
  name: string;
  word: string;
  unit: string;
  digits: number;
  /** Rounded output values, one per row. */
  values: number[];
};

type OutCorrection = {
  row: number;
  pressure: number;
  column: TableColumnKey;
  original: number;
  corrected: number;
  rules: TableRule[];
  reason: string;
  withinErrorEstimate: boolean;
};

type Conversion = { a: Affine; factor: number; digits: number };

type Prepared = {
  table: BlackOilTable;
  sample: string;
  revision: number;
  generatedAt: string;
  units: OutputSystem;
  temperature: number;
  temperatureUnit: string;
  bubblePointPressure: number | null;
  solutionGorAtBubblePoint: number | null;
  standardConditions: { label: string; pressure: number; temperature: number };
  /** The report's own base, from which Rs and Bg were rebased ("60 °F, 14.65 psia"). */
  reportStandardConditions: string;
  pressureBasis: PressureBasis;
  barometricPressurePsia: number;
  /** Pressure first, then the table's columns. */
  columns: OutColumn[];
  conversions: Map<TableColumnKey, Conversion>;
};

function oneLine(text: string): string {
  return text.replace(/[\r\n]+/g, " ").trim();
}

function checkOptions(options: TableFormatOptions): {
  generatedAt: string;
  sample: string;
} {
  if (typeof options !== "object" || options === null) {
    throw new TableError(
      "INVALID_OPTIONS",
      "Format options are required: { units, sampleLabel, revision, generatedAt }.",
    );
  }
  if (!(OUTPUT_SYSTEMS as readonly string[]).includes(options.units)) {
    throw new TableError(
      "INVALID_OPTIONS",
      `units must be 'field' or 'metric'; got ${String(options.units)}.`,
      { field: "units" },
    );
  }
  if (
    typeof options.revision !== "number" ||
    !Number.isFinite(options.revision)
  ) {
    throw new TableError(
      "INVALID_OPTIONS",
      `revision must be a number; got ${String(options.revision)}.`,
      { field: "revision" },
    );
  }
  const g = options.generatedAt;
  const date =
    g instanceof Date ? g : typeof g === "string" ? new Date(g) : null;
  if (!date || Number.isNaN(date.getTime())) {
    throw new TableError(
      "INVALID_OPTIONS",
      `generatedAt must be a date or an ISO 8601 time; got ${String(g)}.`,
      { field: "generatedAt" },
    );
  }
  return {
    generatedAt: date.toISOString(),
    sample: oneLine(String(options.sampleLabel ?? "")),
  };
}

/** Canonical → output for one quantity, with the change of standard conditions for gas volumes. */
function outputOf(
  quantity: Quantity,
  system: UnitSystem,
  base: StandardConditions,
  reported: ReferenceConditions | undefined,
): { a: Affine; factor: number } {
  let factor = 1;
  if (base !== system.standardConditions) {
    const f = gasVolumeRebaseFactor(system.standardConditions, base);
    if (quantity === "gas_oil_ratio") factor = f;
    else if (quantity === "gas_fvf") factor = 1 / f;
  }
  return {
    a: affineToCanonical(quantity, system, { standardConditions: reported }),
    factor,
  };
}

/** The bases of a table's numbers, from its options (standard conditions, pressure basis). */
function basisOf(options: TableFormatOptions) {
  const system = outputUnitSystem(options.units);
  const base = options.standardConditions ?? system.standardConditions;
  const reported =
    options.reportStandardConditions ??
    CANONICAL_UNIT_SYSTEM.standardConditions;
  const pressureBasis = options.pressureBasis ?? "absolute";
  const pAbsolute = affineToCanonical("pressure", system);
  const tOut = affineToCanonical("temperature", system);
  const scP = roundTo(fromCanonicalWith(pAbsolute, base.pressurePsia), 6);
  const scT = roundTo(fromCanonicalWith(tOut, base.temperatureF), 6);
  return {
    base,
    reported: options.reportStandardConditions,
    standardConditions: {
      label: `${scT} ${asciiUnit(system.units.temperature)}, ${scP} ${asciiUnit(system.units.pressure)}`,
      pressure: scP,
      temperature: scT,
    },
    reportStandardConditions: standardConditionsLabel(reported),
    rebased: Math.abs(gasVolumeRebaseFactor(reported, base) - 1) > 1e-12,
    pressureBasis,
    pressureUnit: asciiUnit(
      outputPressureUnit(options.units, pressureBasis).id,
    ),
    barometricPressurePsia:
      options.barometricPressurePsia ?? DEFAULT_SAMPLE_BAROMETRIC_PSIA,
  };
}

/** Rounds and converts the table's values once; every format prints from this. */
function prepare(table: BlackOilTable, options: TableFormatOptions): Prepared {
  const { generatedAt, sample } = checkOptions(options);
  const system = outputUnitSystem(options.units);
  const basis = basisOf(options);
  const { base, reported, pressureBasis, barometricPressurePsia } = basis;
  const pOut = affineToCanonical("pressure", system, {
    pressureBasis,
    barometricPressurePsia,
  });
  const tOut = affineToCanonical("temperature", system);
  const n = table.rows.length;

  const pressures = new Array<number>(n);
  for (let i = 0; i < n; i++)
    pressures[i] = fromCanonicalWith(pOut, table.rows[i]!.pressure);
  const pDigits = digitsFor(pressures);
  const pUnit = basis.pressureUnit;
  const columns: OutColumn[] = [
    {
      key: "pressure",
      name: "pressure",
      word: "pressure",
      unit: pUnit,
      digits: pDigits,
      values: pressures.map((p) => roundTo(p, pDigits)),
    },
  ];
  const conversions = new Map<TableColumnKey, Conversion>();
  for (const key of table.columns) {
    const quantity = PROPERTY_QUANTITIES[key];
    const { a, factor } = outputOf(quantity, system, base, reported);
    const values = new Array<number>(n);
    for (let i = 0; i < n; i++)
      values[i] =
        fromCanonicalWith(a, table.rows[i]!.cells[key]!.value) * factor;
    const digits = digitsFor(values);
    for (let i = 0; i < n; i++) values[i] = roundTo(values[i]!, digits);
    conversions.set(key, { a, factor, digits });
    const info = COLUMN_INFO[key];
    columns.push({
      key,
      name: info.name,
      word: info.word,
      unit: asciiUnit(system.units[quantity]),
      digits,
      values,
    });
  }
  const pbRow = table.rows.findIndex((r) => r.bubblePoint);
  const tUnit = asciiUnit(system.units.temperature);
  const rs = conversions.get("solution_gor");
  return {
    table,
    sample,
    revision: options.revision,
    generatedAt,
    units: options.units,
    temperature: roundTo(
      fromCanonicalWith(tOut, table.temperature),
      BASE_DIGITS,
    ),
    temperatureUnit: tUnit,
    bubblePointPressure:
      table.bubblePointPressure === null
        ? null
        : pbRow >= 0
          ? columns[0]!.values[pbRow]!
          : roundTo(
              fromCanonicalWith(pOut, table.bubblePointPressure),
              pDigits,
            ),
    solutionGorAtBubblePoint:
      table.solutionGorAtBubblePoint === null || !rs
        ? null
        : roundTo(
            fromCanonicalWith(rs.a, table.solutionGorAtBubblePoint) * rs.factor,
            rs.digits,
          ),
    standardConditions: basis.standardConditions,
    reportStandardConditions: basis.reportStandardConditions,
    pressureBasis,
    barometricPressurePsia,
    columns,
    conversions,
  };
}

function outValue(t: Prepared, key: TableColumnKey, canonical: number): number {
  const c = t.conversions.get(key)!;
  return roundTo(fromCanonicalWith(c.a, canonical) * c.factor, c.digits);
}

function outError(
  t: Prepared,
  key: TableColumnKey,
  canonical: number | null,
): number | null {
  if (canonical === null) return null;
  const c = t.conversions.get(key)!;
  return roundTo((canonical / Math.abs(c.a.scale)) * c.factor, ERROR_DIGITS);
}

/** The first `limit` corrections in output units, reasons naming the pressure in those units. */
function outCorrections(t: Prepared, limit = Infinity): OutCorrection[] {
  const pUnit = t.columns[0]!.unit;
  return t.table.corrections.slice(0, limit).map((c) => {
    const pressure = t.columns[0]!.values[c.row]!;
    return {
      row: c.row,
      pressure,
      column: c.column,
      original: outValue(t, c.column, c.original),
      corrected: outValue(t, c.column, c.corrected),
      rules: c.rules,
      reason: correctionReason(c.column, `${pressure} ${pUnit}`, c.rules),
      withinErrorEstimate: c.withinErrorEstimate,
    };
  });
}

export type BlackOilTableJsonRow = {
  pressure: number;
  branch: Branch | null;
  bubblePoint: boolean;
  requested: boolean;
  /** null where the table says nothing about the error (warning estimate-unavailable). */
  errorEstimates: Partial<Record<TableColumnKey, number | null>>;
  /** Columns whose value was corrected to keep the order (see `corrections`). */
  corrected: TableColumnKey[];
  /** Warning codes per column, where there are any (see describeWarningCode in app/core/lookup). */
  warnings: Partial<Record<TableColumnKey, readonly LookupWarning[]>>;
} & Partial<Record<TableColumnKey, number>>;

export type BlackOilTableJson = {
  kind: "black-oil-table";
  sample: string;
  revision: number;
  generatedAt: string;
  method: {
    name: LookupMethod;
    degree: [number, number] | null;
    description: string;
  };
  extrapolate: boolean;
  /** Unit ids of every column, plus the temperature. */
  units: {
    system: OutputSystem;
    pressure: string;
    temperature: string;
  } & Partial<Record<TableColumnKey, string>>;
  standardConditions: { label: string; pressure: number; temperature: number };
  /** The report's own standard conditions, from which Rs and Bg were rebased to `standardConditions`. */
  reportStandardConditions: string;
  /** Pressures absolute or gauge (see `units.pressure`); absolute = gauge + barometricPressurePsia. */
  pressureBasis: PressureBasis;
  barometricPressurePsia: number;
  temperature: number;
  bubblePointPressure: number | null;
  solutionGorAtBubblePoint: number | null;
  columns: { key: "pressure" | TableColumnKey; name: string; unit: string }[];
  rows: BlackOilTableJsonRow[];
  corrections: OutCorrection[];
  notes: TableNote[];
  caution: string;
};

/** The table as a plain object, ready for JSON. */
export function formatTableJson(
  table: BlackOilTable,
  options: TableFormatOptions,
): BlackOilTableJson {
  const t = prepare(table, options);
  const units: BlackOilTableJson["units"] = {
    system: t.units,
    pressure: t.columns[0]!.unit,
    temperature: t.temperatureUnit,
  };
  for (const c of t.columns) if (c.key !== "pressure") units[c.key] = c.unit;
  const props = t.columns.slice(1) as (OutColumn & { key: TableColumnKey })[];
  const rows: BlackOilTableJsonRow[] = table.rows.map((r, i) => {
    const row: BlackOilTableJsonRow = {
      pressure: t.columns[0]!.values[i]!,
      branch: r.branch,
      bubblePoint: r.bubblePoint,
      requested: r.requested,
      errorEstimates: {},
      corrected: [],
      warnings: {},
    };
    for (const c of props) {
      const cell = r.cells[c.key]!;
      row[c.key] = c.values[i]!;
      row.errorEstimates[c.key] = outError(t, c.key, cell.errorEstimate);
      if (cell.corrected) row.corrected.push(c.key);
      if (cell.warnings.length > 0) row.warnings[c.key] = cell.warnings;
    }
    return row;
  });
  return {
    kind: "black-oil-table",
    sample: t.sample,
    revision: t.revision,
    generatedAt: t.generatedAt,
    method: {
      name: table.method,
      degree: table.degree,
      description: table.methodDescription,
    },
    extrapolate: table.extrapolate,
    units,
    standardConditions: t.standardConditions,
    reportStandardConditions: t.reportStandardConditions,
    pressureBasis: t.pressureBasis,
    barometricPressurePsia: t.barometricPressurePsia,
    temperature: t.temperature,
    bubblePointPressure: t.bubblePointPressure,
    solutionGorAtBubblePoint: t.solutionGorAtBubblePoint,
    columns: t.columns.map((c) => ({ key: c.key, name: c.name, unit: c.unit })),
    rows,
    corrections: outCorrections(t),
    notes: table.notes,
    caution: TABLE_CAUTION,
  };
}

/**
 * The lines naming the bases of a table's numbers (the text layout's comments; the API writes them as comment
 * lines before a CSV): the standard conditions of Rs and Bg, the report's when they were rebased from it, and
 * the pressure basis when gauge. ASCII, as the rest of the text layout.
 */
export function tableBasisLines(options: TableFormatOptions): string[] {
  const b = basisOf(options);
  const lines = [`standard conditions: ${b.standardConditions.label}`];
  if (b.rebased)
    lines.push(
      `Rs and Bg rebased from the report's standard conditions (${b.reportStandardConditions.replace(/ ?°/g, " deg ")}) as an ideal gas`,
    );
  if (b.pressureBasis === "gauge")
    lines.push(
      `pressures: gauge (${b.pressureUnit}); absolute = gauge + ${b.barometricPressurePsia} psia (the sample's barometric pressure)`,
    );
  return lines;
}

/** Every text cell of the CSV goes through the product's one CSV cell writer (quoting, formula neutralisation). */
function csvField(text: string): string {
  return csvCell(text);
}

function rowNote(
  r: BlackOilTable["rows"][number],
  columns: readonly TableColumnKey[],
): string {
  const corrected = columns.filter((k) => r.cells[k]!.corrected);
  if (!r.bubblePoint && corrected.length === 0) return "";
  const parts: string[] = [];
  if (r.bubblePoint) parts.push("bubble point");
  if (corrected.length > 0)
    parts.push(
      `corrected: ${corrected.map((k) => COLUMN_INFO[k].name).join(" and ")}`,
    );
  return parts.join("; ");
}

/**
 * CSV (RFC 4180, CRLF line ends): a header row whose names carry units, e.g. "pressure (psia)", then one
 * row per pressure. Columns: pressure, the property columns present, branch, note ("bubble point",
 * "corrected: Bo").
 */
export function formatTableCsv(
  table: BlackOilTable,
  options: TableFormatOptions,
): string {
  const t = prepare(table, options);
  const header = [
    ...t.columns.map((c) => `${c.name} (${c.unit})`),
    "branch",
    "note",
  ];
  const lines = [header.map(csvField).join(",")];
  const cols = t.columns.map((c) => c.values);
  for (let i = 0; i < table.rows.length; i++) {
    const r = table.rows[i]!;
    let line = "";
    for (let j = 0; j < cols.length; j++)
      line += `${j === 0 ? "" : ","}${csvCell(cols[j]![i]!)}`;
    lines.push(
      `${line},${csvField(r.branch ?? "")},${csvField(rowNote(r, table.columns))}`,
    );
  }
  return `${lines.join("\r\n")}\r\n`;
}

/** Fixed decimals per column where no value needs an exponent, so columns line up; exact numbers kept. */
function columnStrings(values: readonly number[]): string[] {
  const plain = values.map((v) => String(v));
  if (plain.some((s) => /e/i.test(s))) return plain;
  const decimals = Math.max(
    0,
    ...plain.map((s) => (s.includes(".") ? s.length - s.indexOf(".") - 1 : 0)),
  );
  return values.map((v) => formatDecimals(v, decimals));
}

function range(from: number, to: number): string {
  return from === to ? `row ${from}` : `rows ${from}-${to}`;
}

/**
 * Our own plain text layout: comment lines starting with "#" (sample, revision, temperature, bubble point,
 * method, units of every column, standard conditions, generation time, which rows are saturated, the
 * corrections, notes and the caution), then one line per pressure with whitespace-separated, right-aligned
 * columns in the units stated.
 */
export function formatTableText(
  table: BlackOilTable,
  options: TableFormatOptions,
): string {
  const t = prepare(table, options);
  const pUnit = t.columns[0]!.unit;
  const out: string[] = [];
  out.push(
    "# Isopleth black-oil table, resampled at one temperature from measured data",
  );
  out.push(`# sample: ${t.sample}`);
  out.push(`# revision: ${t.revision}`);
  out.push(`# temperature: ${t.temperature} ${t.temperatureUnit}`);
  if (t.bubblePointPressure !== null) {
    const rsUnit = t.columns.find((c) => c.key === "solution_gor")?.unit;
    const rsb =
      t.solutionGorAtBubblePoint === null
        ? ""
        : `; Rs there ${t.solutionGorAtBubblePoint} ${rsUnit}`;
    out.push(
      `# bubble point at this temperature: ${t.bubblePointPressure} ${pUnit}${rsb}`,
    );
  }
  out.push(
    `# method: ${table.methodDescription}${table.extrapolate ? "; extrapolation allowed" : ""}`,
  );
  out.push(
    `# units: ${t.columns.map((c) => `${c.word} ${c.unit === "-" ? "dimensionless" : c.unit}`).join("; ")}`,
  );
  for (const line of tableBasisLines(options)) out.push(`# ${line}`);
  out.push(`# generated: ${t.generatedAt}`);
  const rows = table.rows;
  const n = rows.length;
  const sat = rows.filter((r) => r.branch === "saturated").length;
  if (rows.some((r) => r.branch !== null)) {
    const pbIndex = rows.findIndex((r) => r.bubblePoint);
    const parts: string[] = [];
    if (sat > 0)
      parts.push(
        `${range(1, sat)} saturated (at or below the bubble point${pbIndex >= 0 ? `; row ${pbIndex + 1} is the bubble point` : ""})`,
      );
    if (sat < n)
      parts.push(
        `${range(sat + 1, n)} undersaturated (above the bubble point)`,
      );
    out.push(`# ${parts.join(", ")}`);
  }
  const total = table.corrections.length;
  if (total > 0) {
    out.push(
      `# corrected to keep the order simulators need: ${total} value${total === 1 ? "" : "s"}`,
    );
    const shown = outCorrections(t, 50);
    for (const c of shown) {
      out.push(
        `#   row ${c.row + 1}, ${COLUMN_INFO[c.column].word}: ${c.original} -> ${c.corrected} (${c.rules.map((r) => TABLE_RULE_TEXT[r]).join("; ")})`,
      );
    }
    if (total > shown.length)
      out.push(`#   ... and ${total - shown.length} more (see the JSON form)`);
  }
  for (const note of table.notes)
    if (note.code !== "corrections")
      out.push(`# note: ${oneLine(note.message)}`);
  out.push(`# caution: ${TABLE_CAUTION}`);
  out.push("#");
  const cols = t.columns.map((c) => columnStrings(c.values));
  // the header line starts with "# ": the first column is made wide enough to hold it
  const widths = t.columns.map((c, j) =>
    Math.max(
      c.word.length + (j === 0 ? 2 : 0),
      ...cols[j]!.map((x) => x.length),
    ),
  );
  out.push(
    `# ${t.columns.map((c, j) => c.word.padStart(widths[j]! - (j === 0 ? 2 : 0))).join("  ")}`,
  );
  for (let i = 0; i < n; i++) {
    let line = "";
    for (let j = 0; j < cols.length; j++)
      line += (j === 0 ? "" : "  ") + cols[j]![i]!.padStart(widths[j]!);
    out.push(line);
  }
  return `${out.join("\n")}\n`;
}
