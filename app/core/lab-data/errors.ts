/**
 * Typed errors for misuse of the library by calling code (bad arguments). Bad *input files* never throw:
 * they become Findings.
 */
export type LabDataErrorCode =
  "UNKNOWN_LAYOUT" | "UNKNOWN_UNIT" | "INVALID_DATASET";

export class LabDataError extends Error {
  readonly code: LabDataErrorCode;

  constructor(code: LabDataErrorCode, message: string) {
    super(message);
    this.name = "LabDataError";
    this.code = code;
  }
}

export function isLabDataError(error: unknown): error is LabDataError {
  return error instanceof LabDataError;
}
