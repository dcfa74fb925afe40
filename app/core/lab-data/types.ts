/**
 * Types shared by the upload parser and the QC checks. Everything is plain, JSON-serialisable data:
 * numbers are in the canonical units of app/core/units (psia, °F, rb/STB, scf/STB, cP, lb/ft³, rb/scf, –),
 * and the units the file was written in are kept beside them for display.
 */
import type { PropertyKey, Quantity } from "../units";

export type Severity = "error" | "warning" | "info";

/** The two upload layouts (see README.md). */
export type Layout = "long" | "grid";

export type FileFormat = "csv" | "xlsx";

/** Codes of findings raised while reading a file. */
export type ParseFindingCode =
  | "FILE_TOO_LARGE"
  | "EMPTY_FILE"
  | "WRONG_FILE_TYPE"
  | "BINARY_CONTENT"
  | "UNREADABLE_WORKBOOK"
  | "TOO_MANY_ROWS"
  | "GRID_TOO_LARGE"
  | "CSV_SYNTAX"
  | "UNKNOWN_LAYOUT"
  | "UNKNOWN_COLUMN"
  | "MISSING_COLUMN"
  | "DUPLICATE_COLUMN"
  | "MISSING_UNIT"
  | "UNKNOWN_UNIT"
  | "AMBIGUOUS_UNIT"
  | "WRONG_UNIT"
  | "RAGGED_ROW"
  | "NOT_A_NUMBER"
  | "AMBIGUOUS_DECIMAL"
  | "MISSING_VALUE"
  | "DUPLICATE_POINT"
  | "DUPLICATE_PROPERTY"
  | "NEGATIVE_ABSOLUTE_PRESSURE"
  | "BELOW_ABSOLUTE_ZERO"
  | "CONFLICTING_BUBBLE_POINT"
  | "NO_DATA"
  | "TOO_MANY_FINDINGS"
  | "INTERNAL_ERROR"
  // warnings and notes
  | "CONTENT_TYPE_MISMATCH"
  | "LEGACY_ENCODING"
  | "DECIMAL_COMMA"
  | "EMPTY_COLUMN"
  | "HIDDEN_SHEET_IGNORED"
  | "BUBBLE_POINT_WITHOUT_DATA";

/** Codes of findings raised by runQc. */
export type QcFindingCode =
  | "INVALID_GRID"
  | "OUT_OF_RANGE"
  | "IMPLAUSIBLE"
  | "RS_NOT_RISING_BELOW_PB"
  | "RS_NOT_FLAT_ABOVE_PB"
  | "BO_NOT_RISING_BELOW_PB"
  | "BO_NOT_FALLING_ABOVE_PB"
  | "BG_NOT_FALLING"
  | "OIL_VISCOSITY_NOT_FALLING_BELOW_PB"
  | "OIL_VISCOSITY_NOT_RISING_ABOVE_PB"
  | "OIL_VISCOSITY_NOT_FALLING_WITH_T"
  | "OIL_DENSITY_NOT_RISING_ABOVE_PB"
  | "GAS_VISCOSITY_NOT_RISING"
  | "BUBBLE_POINT_NOT_RISING_WITH_T"
  | "NEGATIVE_TOTAL_COMPRESSIBILITY"
  | "UNDERSATURATED_COMPRESSIBILITY"
  | "BG_Z_MISMATCH"
  | "BG_IMPLIED_Z"
  | "DENSITY_MASS_BALANCE"
  | "OUTLIER"
  | "CORRELATION_DEPARTURE"
  | "BUBBLE_POINT_MISSING"
  | "BUBBLE_POINT_INFERRED"
  | "BUBBLE_POINT_MISMATCH"
  | "CHECK_SKIPPED";

export type FindingCode = ParseFindingCode | QcFindingCode;

/** Where in the uploaded file a finding points: every parse finding names as much of this as it knows. */
export interface FileLocation {
  readonly file: string;
  /** Worksheet name (XLSX only). */
  readonly sheet?: string;
  /** 1-based row (CSV line or spreadsheet row). */
  readonly row?: number;
  /** 1-based column. */
  readonly column?: number;
  /** Spreadsheet column letter ("A", "B", … "AA"). */
  readonly columnLetter?: string;
  /** The offending value as written in the file. */
  readonly value?: string;
}

/** A cell of a parsed dataset, in canonical units; `pressure` of a bubble-point cell is the bubble point. */
export interface QcCell {
  readonly property: PropertyKey | "bubble_point";
  readonly pressure: number;
  readonly temperature: number;
}

export interface Finding {
  readonly code: FindingCode;
  readonly severity: Severity;
  /** One plain sentence for people. */
  readonly message: string;
  /** Parse findings: where in the file. */
  readonly location?: FileLocation;
  /** QC findings: the cells concerned. */
  readonly cells?: readonly QcCell[];
  /** QC findings: the rule that fired (stable id, see README.md). */
  readonly rule?: string;
  /** QC findings: the source or practice behind the rule. */
  readonly source?: string;
}

/** Where a parsed number came from in the file. */
export interface CellSource {
  readonly sheet?: string;
  readonly row: number;
  readonly column: number;
}

/** A unit as written in the file, resolved against the units catalogue. */
export interface UnitRef {
  readonly quantity: Quantity;
  /** Catalogue id, e.g. "psia", "degC", "ft3/scf". */
  readonly id: string;
  /** Display symbol, e.g. "°C", "ft³/scf". */
  readonly symbol: string;
  /** The header text the unit was read from (or the template's label). */
  readonly label: string;
}

/**
 * One property on a pressure × temperature grid, in canonical units:
 * values[i][j] is the value at pressures[i] and temperatures[j] (null = not measured).
 * pressures and temperatures are strictly increasing.
 */
export interface PropertyGrid {
  readonly property: PropertyKey;
  /** The unit the file used for this property. */
  readonly unit: UnitRef;
  /** Canonical unit id of the values (units module). */
  readonly canonicalUnit: string;
  /** The pressure and temperature units the file used for this property's axes. */
  readonly pressureUnit: UnitRef;
  readonly temperatureUnit: UnitRef;
  readonly pressures: readonly number[];
  readonly temperatures: readonly number[];
  readonly values: ReadonlyArray<ReadonlyArray<number | null>>;
  /** Same shape as values: where each value was read (absent for datasets built in code). */
  readonly sources?: ReadonlyArray<ReadonlyArray<CellSource | null>>;
}

/** Bubble-point pressure (psia) at a temperature (°F). */
export interface BubblePoint {
  readonly temperature: number;
  readonly pressure: number;
  readonly source?: CellSource;
}

export type PropertyGrids = { readonly [K in PropertyKey]?: PropertyGrid };

export interface ParsedDataset {
  readonly properties: PropertyGrids;
  /** Sorted by temperature. */
  readonly bubblePoints: readonly BubblePoint[];
  readonly file?: {
    readonly name: string;
    readonly format: FileFormat;
    readonly layout: Layout;
    readonly encoding?: "utf-8" | "utf-16" | "windows-1252";
    readonly delimiter?: "," | ";" | "\t";
    readonly decimalMark: "." | ",";
    /** Sheets that held data (XLSX). */
    readonly sheets?: readonly string[];
  };
}

export type ParseOutcome =
  | {
      readonly ok: true;
      readonly dataset: ParsedDataset;
      readonly warnings: readonly Finding[];
    }
  | {
      readonly ok: false;
      readonly errors: readonly Finding[];
      readonly warnings: readonly Finding[];
    };

export interface ParseOptions {
  /**
   * Barometric pressure (psia) used to convert gauge pressures (psig, barg, kPag, MPag).
   * Default: one standard atmosphere (14.69595 psia). Pass the laboratory's stated value when it has one.
   */
  readonly barometricPsia?: number;
}
