/**
 * Warnings attached to a result. Each is a stable code (used in `Result.warnings`) and a bit (used in the
 * per-point `warnings` bitmask of a batch result). `describeWarning` gives the sentence a person reads.
 */
export const WARNING_CODES = [
  "extrapolated",
  "degree-reduced",
  "missing-data",
  "overshoot",
  "branch-extrapolated",
  "bubble-point-extrapolated",
  "bubble-point-unknown",
  "estimate-unavailable",
  "estimate-unreliable",
] as const;

export type Warning = (typeof WARNING_CODES)[number];

/** Bit of each warning in `BatchResult.warnings` (a Uint16Array; engine bits stay below 1 << 12). */
export const WARNING_FLAGS = {
  extrapolated: 1,
  "degree-reduced": 2,
  "missing-data": 4,
  overshoot: 8,
  "branch-extrapolated": 16,
  "bubble-point-extrapolated": 32,
  "bubble-point-unknown": 64,
  "estimate-unavailable": 128,
  "estimate-unreliable": 256,
} as const satisfies Record<Warning, number>;

export const W_EXTRAPOLATED = WARNING_FLAGS.extrapolated;
export const W_DEGREE_REDUCED = WARNING_FLAGS["degree-reduced"];
export const W_MISSING_DATA = WARNING_FLAGS["missing-data"];
export const W_OVERSHOOT = WARNING_FLAGS.overshoot;
export const W_BRANCH_EXTRAPOLATED = WARNING_FLAGS["branch-extrapolated"];
export const W_BUBBLE_POINT_EXTRAPOLATED =
  WARNING_FLAGS["bubble-point-extrapolated"];
export const W_BUBBLE_POINT_UNKNOWN = WARNING_FLAGS["bubble-point-unknown"];
export const W_ESTIMATE_UNAVAILABLE = WARNING_FLAGS["estimate-unavailable"];
export const W_ESTIMATE_UNRELIABLE = WARNING_FLAGS["estimate-unreliable"];

const DESCRIPTIONS: Record<Warning, string> = {
  extrapolated:
    "The point lies outside the measured values (outside the table, or beyond the last measured cell of a column). The number is an extrapolation; treat it with suspicion.",
  "degree-reduced":
    "Fewer measured points were available than the requested degree needs, so a lower-degree polynomial was used on a smaller zone.",
  "missing-data":
    "Cells that were not measured (empty) lie where the zone would normally be, so the zone was moved or made smaller to avoid them.",
  overshoot:
    "The polynomial left the range of its measured values although those values rise or fall steadily. The shape-preserving (pchip) value is given alongside; prefer it unless you know the property has a maximum or minimum here.",
  "branch-extrapolated":
    "The bubble point moves with temperature, so at least one neighbouring temperature column had to be continued a little past its own bubble point on the branch of this point.",
  "bubble-point-extrapolated":
    "The bubble-point pressure at this temperature was extrapolated, because bubble points are known only for temperatures on one side of it.",
  "bubble-point-unknown":
    "Bubble points were supplied but none is known, so the table was interpolated as if it had no bubble point. A zone may straddle the bubble point.",
  "estimate-unavailable":
    "The table says nothing about how the property changes in this direction (for example a single temperature column and a different temperature, or a point above the bubble point where no undersaturated values were measured), so no error estimate can be given. The value is a guess; do not rely on it.",
  "estimate-unreliable":
    "The error estimate may understate the real error here: the point is extrapolated, lies next to cells that were not measured, or the values change slope sharply (a kink, such as an unmarked bubble point). Treat the value and its estimate with caution.",
};

export function describeWarning(warning: Warning): string {
  return DESCRIPTIONS[warning];
}

/** Expands a warnings bitmask (as in `BatchResult.warnings`) into codes, in the order of WARNING_CODES. */
export function warningsFromFlags(flags: number): Warning[] {
  const out: Warning[] = [];
  for (const code of WARNING_CODES)
    if (flags & WARNING_FLAGS[code]) out.push(code);
  return out;
}
