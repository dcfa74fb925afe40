/**
 * Number (and date) formatting: the one module every page, API output and message takes its numbers from.
 * Pure, with no imports, so every part of app/core can use it; it sits below units and interpolation.
 *
 * ## Significant-digit rules
 *
 * - A measured value is known to about six significant digits: `formatMeasured` and `formatPlain` write at
 *   most 6, drop trailing zeros and float noise (`0.1 + 0.2` → "0.3"), and never group thousands; the
 *   samples list, a summary, writes 5 (`formatListed`).
 * - An error estimate carries two significant digits at most (`formatErrorEstimate`).
 * - A number inside an engine message must let the reader find the cell in the table: integers are written
 *   exactly, other numbers with 10 significant digits (`formatInMessage`).
 * - QC messages round a reading to at least `digits` significant digits but never round away digits before
 *   the decimal point (`formatReading`: 12345.6 → "12346", not "12350").
 * - Pressures and temperatures typed back into a conditions box: 5 and 4 significant digits.
 * - Percentages: a relative difference (`formatDifference`, `formatChange`) or a fraction (`formatPercent`),
 *   each with the digits its place has always shown; a space before "%".
 * - Very small or very large numbers (below 1e-4, from 1e7 or 1e9 up, per format) switch to exponent form.
 *
 * Each named format is documented with the place that shows it; two places that show numbers differently
 * use two names here, so a change to one format never changes another place by accident.
 */

// ---- rules ------------------------------------------------------------------------------------------

/** x rounded to `digits` significant digits, as a number (0 stays 0; NaN and ±Infinity pass through). */
export function roundSignificant(x: number, digits: number): number {
  return Number(x.toPrecision(digits));
}

/** x with at most `digits` significant digits, trailing zeros dropped: 1.23456789 → "1.23457", 2500 → "2500". */
export function formatSignificant(x: number, digits: number): string {
  return String(roundSignificant(x, digits));
}

/** x with exactly `digits` significant digits, trailing zeros kept so a column lines up: 2500 → "2500.00". */
export function formatPrecision(x: number, digits: number): string {
  return x.toPrecision(digits);
}

/** x with exactly `decimals` digits after the point: 12.345 → "12.3" for 1. */
export function formatDecimals(x: number, decimals: number): string {
  return x.toFixed(decimals);
}

// ---- named formats ----------------------------------------------------------------------------------

/** A number in a message, an input field or a plain cell: up to 6 significant digits ("1.23457", "NaN"). */
export function formatPlain(x: number): string {
  return formatSignificant(x, 6);
}

/**
 * A measured value in a table cell (sample page, samples list, revision diff): up to 6 significant digits,
 * exponent below 1e-4 and from 1e9, "" for a missing value.
 */
export function formatMeasured(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value))
    return "";
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs < 1e-4 || abs >= 1e9)
    return value.toExponential(4).replace(/\.?0+e/, "e");
  return formatSignificant(value, 6);
}

/**
 * A reservoir condition in the samples list (a summary; the sample page shows 6 digits): 5 significant digits,
 * exponent below 1e-4 and from 1e9 as formatMeasured, "—" for a missing value.
 */
export function formatListed(value: number | null | undefined): string {
  if (value === null || value === undefined) return "—";
  return formatMeasured(roundSignificant(value, 5));
}

/** A value in the explanation of one lookup (stencil, weights): 7 significant digits, "—" when not finite. */
export function formatDetail(x: number): string {
  return Number.isFinite(x) ? formatSignificant(x, 7) : "—";
}

/**
 * A compared value (compare page table): 5 significant digits with thousands grouped ("12,345"), exponent
 * (4 digits) below 1e-4 and from 1e7, "—" when not finite.
 */
export function formatCompared(v: number): string {
  if (!Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const abs = Math.abs(v);
  if (abs < 1e-4 || abs >= 1e7) return v.toExponential(3);
  return roundSignificant(v, 5).toLocaleString("en-US", {
    maximumFractionDigits: 8,
  });
}

/** A value in a plot's hover text and axis ticks: 5 significant digits, thousands grouped, at most 6 decimals. */
export function formatPlotValue(v: number): string {
  return roundSignificant(v, 5).toLocaleString("en-US", {
    maximumFractionDigits: 6,
  });
}

/** An error estimate ("± 0.0012"): two significant digits, exponent below 1e-4 and from 1e7, "—" when not finite. */
export function formatErrorEstimate(v: number): string {
  if (!Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  return Math.abs(v) < 1e-4 || Math.abs(v) >= 1e7
    ? v.toExponential(1)
    : formatSignificant(v, 2);
}

/** A pressure typed back into a conditions box (after a unit change): 5 significant digits. */
export function formatPressure(v: number): string {
  return formatSignificant(v, 5);
}

/** A temperature typed back into a conditions box (after a unit change): 4 significant digits. */
export function formatTemperature(v: number): string {
  return formatSignificant(v, 4);
}

/**
 * A number in an engine or estimate message: integers exactly (below 1e15), others with `digits`
 * significant digits (10 unless given); NaN and ±Infinity by name.
 */
export function formatInMessage(x: number, digits = 10): string {
  if (Number.isNaN(x)) return "NaN";
  if (!Number.isFinite(x)) return x > 0 ? "Infinity" : "-Infinity";
  if (Number.isInteger(x) && Math.abs(x) < 1e15) return String(x);
  return formatSignificant(x, digits);
}

/**
 * A reading in a QC message: `digits` significant digits (4 unless given) but never fewer than its integer
 * digits, trailing zeros dropped; exponent below 1e-4 and from 1e7.
 */
export function formatReading(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const abs = Math.abs(x);
  if (abs >= 1e7 || abs < 1e-4)
    return x.toExponential(Math.max(0, digits - 1)).replace(/\.?0+e/, "e");
  const magnitude = Math.floor(Math.log10(abs));
  const decimals = Math.max(0, digits - 1 - magnitude);
  const text = x.toFixed(Math.min(decimals, 12));
  return text.includes(".") ? text.replace(/\.?0+$/, "") : text;
}

/** Two readings with just enough digits to tell them apart (4 to 10 significant digits). */
export function formatReadingPair(a: number, b: number): [string, string] {
  for (let d = 4; d <= 10; d++) {
    const fa = formatReading(a, d);
    const fb = formatReading(b, d);
    if (fa !== fb) return [fa, fb];
  }
  return [formatReading(a, 10), formatReading(b, 10)];
}

/** A fraction as a percentage in a QC message: 0.123 → "12 %". */
export function formatPercent(fraction: number): string {
  return `${formatReading(fraction * 100, 2)} %`;
}

/** A signed fraction as a percentage in a QC message: "+12 %" or "−7.5 %". */
export function formatSignedPercent(fraction: number): string {
  const text = formatReading(Math.abs(fraction) * 100, 2);
  return `${fraction < 0 ? "−" : "+"}${text} %`;
}

/**
 * A relative difference already in percent (compare page): "+12.3 %", "−0.42 %", "0.00 %"; 2 decimals
 * below 10 %, 1 below 100 %, none above; a true minus sign.
 */
export function formatDifference(pct: number): string {
  const abs = Math.abs(pct);
  const text =
    abs >= 100 ? pct.toFixed(0) : abs >= 10 ? pct.toFixed(1) : pct.toFixed(2);
  return `${pct > 0 ? "+" : pct < 0 ? "−" : ""}${text.replace("-", "")} %`;
}

/**
 * The signed relative change from one value to another (revision diff): "+1.2 %", "-0.034 %"; "" when it
 * cannot be computed. No decimals from 10 %, one from 1 %, two significant digits below.
 */
export function formatChange(from: number | null, to: number | null): string {
  if (from === null || to === null || from === 0) return "";
  const pct = ((to - from) / Math.abs(from)) * 100;
  const text =
    Math.abs(pct) >= 10
      ? pct.toFixed(0)
      : Math.abs(pct) >= 1
        ? pct.toFixed(1)
        : pct.toPrecision(2);
  return `${pct > 0 ? "+" : ""}${text} %`;
}

/** A date-time as "2026-03-14 09:26 UTC" (the same on the server and in the browser); "—" when absent. */
export function formatDateTime(
  value: Date | string | null | undefined,
): string {
  if (!value) return "—";
  const d = typeof value === "string" ? new Date(value) : value;
  return `${d.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

/** A file size in messages: "2.5 MB" (mebibytes, one decimal). */
export function formatFileSize(bytes: number): string {
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/** A duration in milliseconds, one decimal ("12.3"), as timings and the Server-Timing header show it. */
export function formatMilliseconds(ms: number): string {
  return ms.toFixed(1);
}
