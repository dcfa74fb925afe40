/**
 * Warning codes of a lookup result: the engine's codes (app/core/interpolation/warnings.ts) plus
 * `pchip-fallback`, set by the automatic method where it replaced an overshooting Newton value by the
 * shape-preserving one. Plain-word texts come from the engine's `describeWarning` for its own codes.
 */
import {
  describeWarning,
  WARNING_CODES,
  WARNING_FLAGS,
  type Warning,
} from "../interpolation";

export const PCHIP_FALLBACK = "pchip-fallback" as const;

export const LOOKUP_WARNING_CODES = [...WARNING_CODES, PCHIP_FALLBACK] as const;

export type LookupWarning = Warning | typeof PCHIP_FALLBACK;

/** Bit of `pchip-fallback` in the warning masks of `runLookupColumns` (above the engine's bits). */
export const W_PCHIP_FALLBACK = 1 << 12;

const FALLBACK_TEXT =
  "Newton interpolation overshot here: its value left the range of the measured values around the point, although those values rise or fall steadily. The automatic method therefore gives the shape-preserving (pchip) value instead.";

export function isLookupWarning(code: string): code is LookupWarning {
  return (LOOKUP_WARNING_CODES as readonly string[]).includes(code);
}

/** The sentence a person reads for a warning code. */
export function describeWarningCode(code: LookupWarning): string {
  return code === PCHIP_FALLBACK ? FALLBACK_TEXT : describeWarning(code);
}

const ENGINE_BITS: ReadonlyArray<readonly [Warning, number]> =
  WARNING_CODES.map((code) => [code, WARNING_FLAGS[code]] as const);

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
 * Codes and plain-word messages of a warning mask (engine bits plus W_PCHIP_FALLBACK), as frozen arrays
 * shared by every point with the same mask. With `pchip-fallback` the engine's overshoot sentence (which
 * speaks of a pchip value "given alongside") is left out of the messages: the fallback sentence covers it.
 */
export function expandWarningFlags(flags: number): Expanded {
  if (flags === 0) return EMPTY;
  let hit = expandedCache.get(flags);
  if (hit) return hit;
  const warnings: LookupWarning[] = [];
  const messages: string[] = [];
  const fallback = (flags & W_PCHIP_FALLBACK) !== 0;
  for (const [code, bit] of ENGINE_BITS) {
    if ((flags & bit) === 0) continue;
    warnings.push(code);
    if (!(fallback && code === "overshoot"))
      messages.push(describeWarning(code));
  }
  if (fallback) {
    warnings.push(PCHIP_FALLBACK);
    messages.push(FALLBACK_TEXT);
  }
  hit = Object.freeze({
    warnings: Object.freeze(warnings),
    messages: Object.freeze(messages),
  });
  expandedCache.set(flags, hit);
  return hit;
}

/** Warning codes of a mask (engine bits plus W_PCHIP_FALLBACK), in the order of LOOKUP_WARNING_CODES. */
export function lookupWarningsFromFlags(
  flags: number,
): readonly LookupWarning[] {
  return expandWarningFlags(flags).warnings;
}
