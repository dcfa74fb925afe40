/**
 * The one error type the lookup throws. runLookup and runLookupColumns throw it only for a malformed request
 * (options, points, too many points) or an unusable grid; a point that cannot be served is refused in place
 * (`refused` on its result), and OUT_OF_RANGE, NO_VALID_ZONE and EXTRAPOLATION_TOO_FAR describe such a
 * point (`toLookupError`, used for the refusal messages and by the tables). `code` is stable and machine-readable (for API problem details and
 * tests); `message` is written for a person and gives numbers in the caller's units.
 */
export type LookupErrorCode =
  /** options are not an object, or method, degree, units, property or extrapolate is not allowed */
  | "INVALID_OPTIONS"
  /** points are not an array of { pressure, temperature } or two equally long number columns */
  | "INVALID_POINTS"
  /** a point is NaN/Infinity, a negative absolute pressure or below absolute zero */
  | "INVALID_POINT"
  /** more points than MAX_LOOKUP_POINTS */
  | "TOO_MANY_POINTS"
  /** the stored grid is malformed (a data problem on our side, not the caller's) */
  | "INVALID_GRID"
  /** a point lies outside the measured pressure or temperature range and extrapolation was not asked for */
  | "OUT_OF_RANGE"
  /** missing cells or an empty branch leave no measured values around a point */
  | "NO_VALID_ZONE"
  /** a point lies farther outside the measured range than `maxExtrapolation` allows */
  | "EXTRAPOLATION_TOO_FAR";

export class LookupError extends Error {
  readonly code: LookupErrorCode;
  /** Structured facts behind the message (point index, axis, value and range in the caller's units, ...). */
  readonly details: Readonly<Record<string, unknown>>;

  constructor(
    code: LookupErrorCode,
    message: string,
    details: Record<string, unknown> = {},
    cause?: unknown,
  ) {
    super(message, cause === undefined ? undefined : { cause });
    this.name = "LookupError";
    this.code = code;
    this.details = details;
  }
}

export function isLookupError(error: unknown): error is LookupError {
  return error instanceof LookupError;
}
