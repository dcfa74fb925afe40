/**
 * Typed errors raised by the unit catalogue. `code` is stable and machine-readable; `message` is for people.
 */
export type UnitErrorCode =
  | "UNKNOWN_UNIT"
  | "AMBIGUOUS_UNIT"
  | "WRONG_QUANTITY"
  | "MISSING_UNIT"
  | "NOT_FINITE"
  | "NEGATIVE_ABSOLUTE_PRESSURE"
  | "BELOW_ABSOLUTE_ZERO"
  | "INVALID_GRAVITY"
  | "INVALID_STANDARD_CONDITIONS";

export class UnitError extends Error {
  readonly code: UnitErrorCode;
  /** Extra machine-readable context, e.g. the label that failed or the candidate quantities. */
  readonly details: Readonly<Record<string, unknown>>;

  constructor(
    code: UnitErrorCode,
    message: string,
    details: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = "UnitError";
    this.code = code;
    this.details = details;
  }
}

export function isUnitError(error: unknown): error is UnitError {
  return error instanceof UnitError;
}
