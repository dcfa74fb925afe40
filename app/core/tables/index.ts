// Black-oil style tables at one temperature, resampled on requested pressures, in the order simulators
// need, and written as JSON, CSV or our own plain text layout; lookups and tables as spreadsheet sheets
// (sheet.ts). Pure TypeScript; see README.md.
export {
  MAX_TABLE_ROWS,
  parsePressureSpec,
  tableConditionsToCanonical,
} from "./pressure-spec";
export type { PressureSpec } from "./pressure-spec";
export {
  buildBlackOilTable,
  correctionReason,
  TABLE_RULE_TEXT,
} from "./build-table";
export type {
  BlackOilTable,
  BlackOilTableInput,
  TableCell,
  TableCorrection,
  TableNote,
  TableNoteCode,
  TableRow,
  TableRule,
} from "./build-table";
export {
  BASE_DIGITS,
  formatTableCsv,
  formatTableJson,
  formatTableText,
  tableBasisLines,
  TABLE_CAUTION,
} from "./format";
export type {
  BlackOilTableJson,
  BlackOilTableJsonRow,
  TableFormatOptions,
} from "./format";
export { measuredTablePressures } from "./defaults";
export { COLUMN_INFO, OIL_COLUMNS, TABLE_COLUMNS } from "./columns";
export type { ColumnInfo, TableColumnKey } from "./columns";
export { findOrderViolations } from "./check-order";
export type { OrderViolation } from "./check-order";
export {
  enforceDecreasing,
  enforceIncreasing,
  isotonicIncreasing,
  makePositive,
} from "./order";
export type { OrderOptions } from "./order";
export { isTableError, TableError } from "./errors";
export {
  DEFAULT_EXPORT_DIGITS,
  lookupSheet,
  roundCondition,
  measuredDigits,
  roundEstimate,
  roundForExport,
  sheetToDelimited,
  tableSheet,
  UTF8_BOM,
} from "./sheet";
export type { ExportPoint, LookupSheetInput, Sheet, SheetCell } from "./sheet";
export type { TableErrorCode } from "./errors";
