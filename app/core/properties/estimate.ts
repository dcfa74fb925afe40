/**
 * The result shape shared by every method: `{ value, warnings }`, plus the helpers that validate inputs
 * (throwing PropertyInputError) and compare them with a method's published data range (returning warnings).
 */
import { RANKINE_OFFSET } from "../units";
import { PropertyInputError } from "./errors";
import { formatInMessage } from "../format";

export type PropertyWarningCode =
  /** An input (or the result) lies outside the data range the method was fitted to. */
  | "OUTSIDE_CORRELATION_RANGE"
  /** The method returned a value that is not physically meaningful (e.g. negative Rs, negative co). */
  | "NONPHYSICAL_RESULT"
  /** A data point was left out of a fit or flagged by a consistency test. */
  | "DATA_FLAG";

export interface PropertyWarning {
  readonly code: PropertyWarningCode;
  /** The method that raised it, e.g. "standing-1947-bubble-point". */
  readonly method: string;
  /** The input (or "result") concerned. */
  readonly input?: string;
  readonly value?: number;
  readonly min?: number;
  readonly max?: number;
  readonly message: string;
}

export interface Estimate<T = number> {
  readonly value: T;
  readonly warnings: readonly PropertyWarning[];
}

/** A published data range of one input of a method. `source` says where the numbers come from. */
export interface ValidityRange {
  readonly input: string;
  readonly unit: string;
  readonly min: number;
  readonly max: number;
  readonly source: string;
}

export type ValidityRanges = Readonly<Record<string, ValidityRange>>;

/** Warnings for every named value that lies outside its range (inclusive bounds). */
export function rangeWarnings(
  method: string,
  ranges: ValidityRanges,
  values: Readonly<Record<string, number | undefined>>,
): PropertyWarning[] {
  const warnings: PropertyWarning[] = [];
  for (const [key, value] of Object.entries(values)) {
    const range = ranges[key];
    if (range === undefined || value === undefined) continue;
    if (value < range.min || value > range.max) {
      warnings.push({
        code: "OUTSIDE_CORRELATION_RANGE",
        method,
        input: range.input,
        value,
        min: range.min,
        max: range.max,
        message:
          `${range.input} = ${formatInMessage(value, 5)} ${range.unit} is outside the ${method} data range ` +
          `${formatInMessage(range.min, 5)}–${formatInMessage(range.max, 5)} ${range.unit}; the value is an extrapolation.`,
      });
    }
  }
  return warnings;
}

// ---- input validation (throws) -------------------------------------------------------------------------

export function requireFinite(input: string, value: number): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new PropertyInputError(
      "NOT_FINITE",
      input,
      value,
      `${input} must be a finite number, got ${String(value)}.`,
    );
  }
  return value;
}

/** Absolute pressure in psia: finite and > 0. */
export function requirePressure(input: string, psia: number): number {
  requireFinite(input, psia);
  if (psia <= 0) {
    throw new PropertyInputError(
      "NEGATIVE_ABSOLUTE_PRESSURE",
      input,
      psia,
      `${input} must be an absolute pressure above 0 psia, got ${psia}. Was a gauge value passed as absolute?`,
    );
  }
  return psia;
}

/** Temperature in °F above absolute zero; returns °R. */
export function requireTemperature(input: string, degF: number): number {
  requireFinite(input, degF);
  if (degF <= -RANKINE_OFFSET) {
    throw new PropertyInputError(
      "BELOW_ABSOLUTE_ZERO",
      input,
      degF,
      `${input} = ${degF} °F is at or below absolute zero (−459.67 °F).`,
    );
  }
  return degF + RANKINE_OFFSET;
}

export function requirePositive(
  input: string,
  value: number,
  what = "must be > 0",
): number {
  requireFinite(input, value);
  if (value <= 0)
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      input,
      value,
      `${input} ${what}, got ${value}.`,
    );
  return value;
}

export function requireNonNegative(input: string, value: number): number {
  requireFinite(input, value);
  if (value < 0)
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      input,
      value,
      `${input} must be ≥ 0, got ${value}.`,
    );
  return value;
}

/** °API: the SG definition needs API > −131.5; stock-tank oils are 0–100 °API. */
export function requireApi(input: string, api: number): number {
  requireFinite(input, api);
  if (api <= 0 || api > 100) {
    throw new PropertyInputError(
      "OUT_OF_DOMAIN",
      input,
      api,
      `${input} must be between 0 and 100 °API, got ${api}.`,
    );
  }
  return api;
}

export function mergeWarnings(
  ...lists: ReadonlyArray<readonly PropertyWarning[]>
): PropertyWarning[] {
  const seen = new Set<string>();
  const out: PropertyWarning[] = [];
  for (const list of lists) {
    for (const w of list) {
      const key = `${w.code}|${w.method}|${w.input ?? ""}|${w.value ?? ""}`;
      if (seen.has(key)) continue;
      seen.add(key);
      out.push(w);
    }
  }
  return out;
}
