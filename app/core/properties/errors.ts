/**
 * Typed errors for invalid input to a fluid-property method. Inputs that are physically possible but lie
 * outside a correlation's published data range are NOT errors: they return warnings (see estimate.ts).
 */
export type PropertyErrorCode =
  | "NOT_FINITE"
  | "NEGATIVE_ABSOLUTE_PRESSURE"
  | "BELOW_ABSOLUTE_ZERO"
  | "OUT_OF_DOMAIN"
  | "INSUFFICIENT_DATA";

export class PropertyInputError extends Error {
  readonly code: PropertyErrorCode;
  /** Which input was wrong (e.g. "pressure", "gasGravity"). */
  readonly input: string;
  readonly value: unknown;

  constructor(
    code: PropertyErrorCode,
    input: string,
    value: unknown,
    message: string,
  ) {
    super(message);
    this.name = "PropertyInputError";
    this.code = code;
    this.input = input;
    this.value = value;
  }
}

export function isPropertyInputError(
  error: unknown,
): error is PropertyInputError {
  return error instanceof PropertyInputError;
}
