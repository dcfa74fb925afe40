/**
 * The one error type the interpolation engine throws. `code` is stable and machine-readable (for API
 * responses and tests); `message` is written for a person and names the axis, value, range or cell involved.
 */
import { formatInMessage } from "../format";
export type InterpolationErrorCode =
  /** grid is not an object with arrays `pressures`, `temperatures` and `values` */
  | "invalid-grid-shape"
  /** an axis has no values */
  | "axis-empty"
  /** an axis value is NaN, Infinity or not a number */
  | "axis-not-finite"
  /** an axis is unsorted or repeats a value */
  | "axis-not-increasing"
  /** `values` does not have one row per pressure and one entry per temperature */
  | "ragged-values"
  /** a measured value is NaN, Infinity or not a number (use null for "not measured") */
  | "value-not-finite"
  /** `bubblePoints` has the wrong length or a non-finite entry */
  | "invalid-bubble-points"
  /** the point (or a batch of points) is malformed, NaN or Infinity */
  | "invalid-point"
  /** unknown method, or a degree that is not a whole number from 1 to MAX_DEGREE */
  | "invalid-options"
  /** the point lies outside the measured range and `extrapolate` is not set */
  | "out-of-range"
  /** missing cells (null) or an empty branch leave no measured values around the point */
  | "no-valid-zone"
  /** extrapolation is allowed, but the point lies farther outside the range than `maxExtrapolation` */
  | "extrapolation-too-far";

export class InterpolationError extends Error {
  readonly code: InterpolationErrorCode;
  /** Structured facts behind the message (axis, index, value, range, point index in a batch, ...). */
  readonly details: Readonly<Record<string, unknown>>;

  constructor(
    code: InterpolationErrorCode,
    message: string,
    details: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = "InterpolationError";
    this.code = code;
    this.details = details;
  }
}

/** Describes a value that is not a finite number, for messages ("NaN", "Infinity", "a string", "undefined"). */
export function describeBadNumber(x: unknown): string {
  if (typeof x === "number") return formatInMessage(x);
  if (x === undefined) return "undefined (an empty slot)";
  if (x === null) return "null";
  return `a ${typeof x} (${JSON.stringify(x)})`;
}
