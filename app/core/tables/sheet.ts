/**
 * Spreadsheet exports: one plain model of a sheet (lines that say what it is, a header in words with units,
 * rows of numbers and text), built from a lookup or a black-oil table, and written as CSV here (the XLSX
 * writer, which needs exceljs, is on the server and writes the same model). Pure TypeScript.
 *
 * Rounding (see README, "Exports"): a value is written with the significant digits the measured data carry —
 * the most any measured value of its grid has in the unit the laboratory reported it in (`measuredDigits`),
 * 6 when that cannot be read off the grid — and never more than the error estimate supports (the value ends
 * at the decimal place of the estimate's second significant digit). Error estimates have two significant
 * digits. Conditions are written as given (10 significant digits, which drops the round-off of a unit
 * conversion).
 */
import { csvCommentLine, csvRow, type CsvValue } from "../csv";
import { roundSignificant } from "../format";
import { outputUnit, PROPERTIES, type PropertyKey } from "../units";
import type { BlackOilTableJson } from "./format";

export type SheetCell = string | number | null;

export type Sheet = {
  /** Worksheet name (XLSX), at most 31 characters. */
  name: string;
  /** Lines above the header: what the sheet is, its sample, revision, method, units and the caution. */
  about: string[];
  /** Column headers in words with their unit, e.g. "Oil formation volume factor (rb/STB)". */
  header: string[];
  rows: SheetCell[][];
};

/** Significant digits of a value when its grid does not say (the format module's rule for measured values). */
export const DEFAULT_EXPORT_DIGITS = 6;
/** Significant digits of an error estimate. */
const ESTIMATE_DIGITS = 2;
/** Significant digits of a condition written back (drops the binary round-off of a unit conversion). */
const CONDITION_DIGITS = 10;
/** A value written with more digits than this in its laboratory unit is a conversion's round-off, not a reading. */
const MAX_READING_DIGITS = 10;

/** Significant digits of x as its shortest decimal form writes it; integers count every digit (2500 → 4). */
export function significantDigitsOf(x: number): number {
  if (!Number.isFinite(x) || x === 0) return 0;
  const text = String(Math.abs(x));
  const mantissa = text.split("e")[0]!;
  return mantissa.replace(".", "").replace(/^0+/, "").length;
}

/**
 * The most significant digits a measured value of the grid carries, each value first converted back to the
 * unit the laboratory reported (`toReported`; identity when omitted). Values whose decimal form has more than
 * 10 digits there are the round-off of a conversion and are not counted; null when no value can be read.
 */
export function measuredDigits(
  values: readonly (readonly (number | null)[])[],
  toReported: (canonical: number) => number = (v) => v,
): number | null {
  let most = 0;
  for (const row of values)
    for (const v of row) {
      if (v === null || !Number.isFinite(v) || v === 0) continue;
      let reported: number;
      try {
        reported = toReported(v);
      } catch {
        continue;
      }
      const d = significantDigitsOf(reported);
      if (d > 0 && d <= MAX_READING_DIGITS && d > most) most = d;
    }
  return most > 0 ? most : null;
}

/**
 * A value rounded as exports write it: `digits` significant digits (the grid's, or 6), fewer where the error
 * estimate says the later digits are noise (the value then ends at the estimate's second significant digit),
 * never fewer than two.
 */
export function roundForExport(
  value: number,
  errorEstimate: number | null,
  digits: number | null,
): number {
  if (!Number.isFinite(value) || value === 0) return value;
  let d = digits ?? DEFAULT_EXPORT_DIGITS;
  if (errorEstimate !== null && Number.isFinite(errorEstimate)) {
    const e = Math.abs(errorEstimate);
    if (e > 0) {
      const supported =
        Math.floor(Math.log10(Math.abs(value))) -
        Math.floor(Math.log10(e)) +
        ESTIMATE_DIGITS;
      d = Math.min(d, supported);
    }
  }
  return clean(roundSignificant(value, Math.max(2, Math.min(17, d))));
}

/** An error estimate as exports write it: two significant digits. */
export function roundEstimate(errorEstimate: number | null): number | null {
  if (errorEstimate === null || !Number.isFinite(errorEstimate)) return null;
  return clean(roundSignificant(errorEstimate, ESTIMATE_DIGITS));
}

/** A condition written back: 10 significant digits. */
export function roundCondition(x: number): number {
  return clean(roundSignificant(x, CONDITION_DIGITS));
}

/** -0 → 0 (a spreadsheet shows "-0"). */
function clean(x: number): number {
  return Object.is(x, -0) ? 0 : x;
}

/** "Oil formation volume factor (rb/STB)"; a dimensionless property says so. */
function propertyHeader(property: PropertyKey, unit: string): string {
  const name = PROPERTIES[property].name;
  return `${name} (${isDimensionless(unit) ? "dimensionless" : unit})`;
}

function isDimensionless(unit: string): boolean {
  return unit === "" || unit === "-" || unit === "–" || unit === "1";
}

/** One point of a lookup as an export reads it (the API's per-point result, or a stored run's). */
export type ExportPoint = {
  value: number | null;
  errorEstimate: number | null;
  warnings: readonly string[];
  method?: string | null;
  /** A point the lookup could not serve: no value, and why. */
  refused?: { code: string; message: string } | null;
};

export type LookupSheetInput = {
  name?: string;
  about: readonly string[];
  pressureUnit: string;
  temperatureUnit: string;
  conditions: readonly { pressure: number; temperature: number }[];
  properties: readonly {
    property: PropertyKey;
    /** The value unit, e.g. "rb/STB". */
    unit: string;
    /** One per condition. */
    points: readonly (ExportPoint | undefined)[];
    /** The grid's measured digits (`measuredDigits`); null = not known (6 digits). */
    digits: number | null;
  }[];
};

/**
 * A lookup as a sheet: pressure, temperature, then per property its value, error estimate, method and
 * warnings (a refused point: no value, and "refused: <why>").
 */
export function lookupSheet(input: LookupSheetInput): Sheet {
  const header = [
    `Pressure (${input.pressureUnit})`,
    `Temperature (${input.temperatureUnit})`,
  ];
  for (const p of input.properties) {
    const name = PROPERTIES[p.property].name;
    const unit = isDimensionless(p.unit) ? "dimensionless" : p.unit;
    header.push(
      `${name} (${unit})`,
      `${name} error estimate (${unit})`,
      `${name} method`,
      `${name} warnings`,
    );
  }
  const rows = input.conditions.map((c, i) => {
    const cells: SheetCell[] = [
      roundCondition(c.pressure),
      roundCondition(c.temperature),
    ];
    for (const p of input.properties) {
      const x = p.points[i];
      if (!x) {
        cells.push(null, null, null, "not computed");
        continue;
      }
      if (x.refused || x.value === null) {
        cells.push(
          null,
          null,
          x.method ?? null,
          x.refused
            ? `refused: ${x.refused.message}`
            : "not computed: the lookup gave no value",
        );
        continue;
      }
      cells.push(
        roundForExport(x.value, x.errorEstimate, p.digits),
        roundEstimate(x.errorEstimate),
        x.method ?? null,
        x.warnings.join(", "),
      );
    }
    return cells;
  });
  return {
    name: input.name ?? "Lookup",
    about: [...input.about],
    header,
    rows,
  };
}

/**
 * A black-oil table as a sheet, from its JSON form (so the numbers are exactly those of the JSON, CSV and text
 * forms: converted once, rounded once): pressure, the property columns, branch and note, then the error
 * estimate of each column. The about lines name the sample, revision, temperature, bubble point, method,
 * standard conditions, notes and the caution; `lead` lines (e.g. a draft warning) come first.
 */
export function tableSheet(
  table: BlackOilTableJson,
  lead: readonly string[] = [],
): Sheet {
  const system = table.units.system;
  const unitOf = (key: PropertyKey) => outputUnit(system, key).symbol;
  const pUnit = outputUnit(system, "pressure").symbol;
  const tUnit = outputUnit(system, "temperature").symbol;
  const keys = table.columns
    .map((c) => c.key)
    .filter((k): k is Exclude<typeof k, "pressure"> => k !== "pressure");
  const header = [
    `Pressure (${pUnit})`,
    ...keys.map((k) => propertyHeader(k, unitOf(k))),
    "Branch",
    "Note",
    ...keys.map(
      (k) =>
        `${PROPERTIES[k].name} error estimate (${isDimensionless(unitOf(k)) ? "dimensionless" : unitOf(k)})`,
    ),
  ];
  const rows = table.rows.map((r) => {
    const notes: string[] = [];
    if (r.bubblePoint) notes.push("bubble point");
    if (r.corrected.length > 0)
      notes.push(
        `corrected: ${r.corrected.map((k) => PROPERTIES[k].name).join(" and ")}`,
      );
    return [
      r.pressure,
      ...keys.map((k) => r[k] ?? null),
      r.branch ?? "",
      notes.join("; "),
      ...keys.map((k) => roundEstimate(r.errorEstimates[k] ?? null)),
    ];
  });
  const about = [
    ...lead,
    "Isopleth black-oil table, resampled at one temperature from measured data",
    `Sample: ${table.sample}; revision ${table.revision}`,
    `Temperature: ${table.temperature} ${tUnit}`,
    ...(table.bubblePointPressure === null
      ? []
      : [
          `Bubble point at this temperature: ${table.bubblePointPressure} ${pUnit}${table.solutionGorAtBubblePoint === null ? "" : `; Rs there ${table.solutionGorAtBubblePoint} ${unitOf("solution_gor")}`}`,
        ]),
    `Method: ${table.method.description}${table.extrapolate ? "; extrapolation allowed" : ""}`,
    `Gas volumes at standard conditions ${table.standardConditions.label.replace(/deg ([FC])/g, "°$1")}`,
    `Generated ${table.generatedAt}`,
    ...table.notes
      .filter((n) => n.code !== "corrections" || table.corrections.length > 0)
      .map((n) => `Note: ${n.message}`),
    `Caution: ${table.caution}`,
  ];
  return { name: "Black-oil table", about, header, rows };
}

type DelimitedOptions = {
  /** "," (CSV, the default) or "\t" (the clipboard). */
  delimiter?: "," | "\t";
  /** Start with the UTF-8 byte-order mark, so spreadsheets read °F and ft³ as written. Default true. */
  bom?: boolean;
  /** Write the sheet's "about" lines as "# …" comment lines above the header. Default true. */
  about?: boolean;
};

/** UTF-8 byte-order mark: spreadsheet programs read a CSV as UTF-8 only when it starts with one. */
export const UTF8_BOM = "\uFEFF";

/**
 * The sheet as delimited text: RFC 4180, CRLF line ends, every cell through the product's one CSV cell writer
 * (numbers stay numbers, formula-like text is neutralised), the about lines as one-cell "# …" comment lines.
 */
export function sheetToDelimited(
  sheet: Sheet,
  options: DelimitedOptions = {},
): string {
  const delimiter = options.delimiter ?? ",";
  const lines = [
    ...(options.about === false
      ? []
      : sheet.about.map((a) => csvCommentLine(a, { delimiter }))),
    csvRow(sheet.header, { delimiter }),
    ...sheet.rows.map((r) => csvRow(r as CsvValue[], { delimiter })),
  ];
  return `${options.bom === false ? "" : UTF8_BOM}${lines.join("\r\n")}\r\n`;
}
