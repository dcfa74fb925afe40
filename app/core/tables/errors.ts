/**
 * The one error type of the tables module. `code` is stable and machine-readable (API problem details,
 * tests); `message` is written for a person and names the entry, number or column at fault.
 */
export type TableErrorCode =
  /** the pressure specification is empty or neither a list "a,b,c" nor a range "start:stop:step" */
  | "MALFORMED_PRESSURES"
  /** an entry is not a number */
  | "INVALID_NUMBER"
  /** an entry is NaN or infinite */
  | "NOT_FINITE"
  /** a pressure is zero or negative (pressures are absolute) */
  | "NOT_POSITIVE"
  /** a listed pressure is not above the one before it */
  | "NOT_INCREASING"
  /** the step of a range is zero or negative */
  | "INVALID_STEP"
  /** the stop of a range lies below its start */
  | "INVALID_RANGE"
  /** more rows than MAX_TABLE_ROWS */
  | "TOO_MANY_ROWS"
  /** temperature, method, degree or grids are not usable */
  | "INVALID_OPTIONS"
  /** no grid of a table column was given */
  | "NO_GRIDS"
  /** an oil grid has no known bubble point, so saturated and undersaturated rows cannot be told apart */
  | "NO_BUBBLE_POINT"
  /** a row lies outside a grid's measured range and extrapolation was not asked for */
  | "OUT_OF_RANGE"
  /** missing cells leave no measured values around a row */
  | "NO_VALID_ZONE"
  /** a stored grid is malformed */
  | "INVALID_GRID"
  /** a column has no physically possible value at all (e.g. every viscosity ≤ 0) */
  | "NONPHYSICAL_COLUMN"
  /** no row (or not the bubble point) gives a finite value: far beyond the measured data */
  | "NOT_COMPUTABLE";

export class TableError extends Error {
  readonly code: TableErrorCode;
  readonly details: Readonly<Record<string, unknown>>;

  constructor(
    code: TableErrorCode,
    message: string,
    details: Record<string, unknown> = {},
    cause?: unknown,
  ) {
    super(message, cause === undefined ? undefined : { cause });
    this.name = "TableError";
    this.code = code;
    this.details = details;
  }
}

export function isTableError(error: unknown): error is TableError {
  return error instanceof TableError;
}
