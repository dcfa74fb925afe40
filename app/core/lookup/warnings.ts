/**
 * The one typed list of warning codes of a lookup result (`LOOKUP_WARNING_CODES`), shared by the server, the
 * API and the browser (which imports it and never recomputes a warning):
 *
 * - the engine's codes (app/core/interpolation/warnings.ts, bits below 1 << 12);
 * - `pchip-fallback` (bit 1 << 12): the automatic method replaced an overshooting Newton value by the
 *   shape-preserving one;
 * - `near-bubble-point` (bit 1 << 13): the point lies close to the bubble point at its temperature, where
 *   the property has a kink (NEAR_BUBBLE_POINT rule below).
 *
 * Plain-word texts come from the engine's `describeWarning` for its own codes.
 */
import {
  describeWarning,
  WARNING_CODES,
  WARNING_FLAGS,
  type Warning,
} from "../interpolation";

export const PCHIP_FALLBACK = "pchip-fallback" as const;
export const NEAR_BUBBLE_POINT = "near-bubble-point" as const;

/** The lookup's own codes, computed on the server (lookupCanonical), in the order of their bits. */
export const LOOKUP_ONLY_WARNING_CODES = [
  PCHIP_FALLBACK,
  NEAR_BUBBLE_POINT,
] as const;

export const LOOKUP_WARNING_CODES = [
  ...WARNING_CODES,
  ...LOOKUP_ONLY_WARNING_CODES,
] as const;

export type LookupWarning = (typeof LOOKUP_WARNING_CODES)[number];

/** Bit of `pchip-fallback` in the warning masks of `runLookupColumns` (above the engine's bits). */
export const W_PCHIP_FALLBACK = 1 << 12;
/** Bit of `near-bubble-point`. */
export const W_NEAR_BUBBLE_POINT = 1 << 13;

/**
 * The near-bubble-point rule: a point is near the bubble point pb (absolute pressure, at the point's
 * temperature) when |p − pb| ≤ min(NEAR_BUBBLE_POINT_FRACTION × pb, one pressure step of the grid at pb —
 * the spacing of the two measured pressures around pb, or of the nearest two when pb lies outside them).
 * 2 % is common practice, not a standard; the grid step keeps the flag to the cell of the kink on coarse
 * grids.
 */
export const NEAR_BUBBLE_POINT_FRACTION = 0.02;

const TEXTS: Record<(typeof LOOKUP_ONLY_WARNING_CODES)[number], string> = {
  [PCHIP_FALLBACK]:
    "Newton interpolation overshot here: its value left the range of the measured values around the point, although those values rise or fall steadily. The automatic method therefore gives the shape-preserving (pchip) value instead.",
  [NEAR_BUBBLE_POINT]:
    "The point lies close to the bubble point at its temperature (within 2 % of it and within one pressure step of the table). The property has a kink there, so the value is sensitive to the exact bubble-point pressure.",
};

const LOOKUP_BITS: Record<(typeof LOOKUP_ONLY_WARNING_CODES)[number], number> =
  {
    [PCHIP_FALLBACK]: W_PCHIP_FALLBACK,
    [NEAR_BUBBLE_POINT]: W_NEAR_BUBBLE_POINT,
  };

/** Bit of every code in the masks of `runLookupColumns` (the engine's WARNING_FLAGS and the lookup's own). */
export const LOOKUP_WARNING_FLAGS: Readonly<Record<LookupWarning, number>> = {
  ...WARNING_FLAGS,
  ...LOOKUP_BITS,
};

export function isLookupWarning(code: string): code is LookupWarning {
  return (LOOKUP_WARNING_CODES as readonly string[]).includes(code);
}

function isEngineWarning(code: LookupWarning): code is Warning {
  return (WARNING_CODES as readonly string[]).includes(code);
}

/** The sentence a person reads for a warning code. */
export function describeWarningCode(code: LookupWarning): string {
  return isEngineWarning(code)
    ? describeWarning(code)
    : TEXTS[code as keyof typeof TEXTS];
}

const ALL_BITS: ReadonlyArray<readonly [LookupWarning, number]> =
  LOOKUP_WARNING_CODES.map(
    (code) => [code, LOOKUP_WARNING_FLAGS[code]] as const,
  );

type Expanded = {
  warnings: readonly LookupWarning[];
  messages: readonly string[];
};
const EMPTY: Expanded = Object.freeze({
  warnings: Object.freeze([]),
  messages: Object.freeze([]),
});
const expandedCache = new Map<number, Expanded>();

/**
 * Codes and plain-word messages of a warning mask (LOOKUP_WARNING_FLAGS bits), as frozen arrays shared by
 * every point with the same mask, in the order of LOOKUP_WARNING_CODES. With `pchip-fallback` the engine's
 * overshoot sentence (which speaks of a pchip value "given alongside") is left out of the messages: the
 * fallback sentence covers it.
 */
export function expandWarningFlags(flags: number): Expanded {
  if (flags === 0) return EMPTY;
  let hit = expandedCache.get(flags);
  if (hit) return hit;
  const warnings: LookupWarning[] = [];
  const messages: string[] = [];
  const fallback = (flags & W_PCHIP_FALLBACK) !== 0;
  for (const [code, bit] of ALL_BITS) {
    if ((flags & bit) === 0) continue;
    warnings.push(code);
    if (!(fallback && code === "overshoot"))
      messages.push(describeWarningCode(code));
  }
  hit = Object.freeze({
    warnings: Object.freeze(warnings),
    messages: Object.freeze(messages),
  });
  expandedCache.set(flags, hit);
  return hit;
}

/** Warning codes of a mask, in the order of LOOKUP_WARNING_CODES. */
export function lookupWarningsFromFlags(
  flags: number,
): readonly LookupWarning[] {
  return expandWarningFlags(flags).warnings;
}
