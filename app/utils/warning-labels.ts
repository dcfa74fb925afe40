import type { LookupWarning } from "~/core/lookup";

/** Flagged by the server's lookup (app/core/lookup/warnings.ts), never computed in the browser. */
export const NEAR_BUBBLE_POINT = "near-bubble-point" as const;
type BadgeWarning = LookupWarning | typeof NEAR_BUBBLE_POINT;

/**
 * Short labels for the warning badges of lookup results; the full sentence comes from describeWarningCode.
 * Keyed by the engine's own codes, so a code added or renamed in app/core fails the type check here.
 */
export const WARNING_LABELS: Record<BadgeWarning, string> = {
  extrapolated: "extrapolated",
  "degree-reduced": "lower degree",
  "missing-data": "missing cells",
  overshoot: "overshoot",
  "branch-extrapolated": "past a column's bubble point",
  "bubble-point-extrapolated": "bubble point extrapolated",
  "bubble-point-unknown": "bubble point unknown",
  "estimate-unavailable": "no error estimate",
  "estimate-unreliable": "estimate unreliable",
  "pchip-fallback": "pchip used (overshoot)",
  [NEAR_BUBBLE_POINT]: "near the bubble point",
};

/** Warnings that mean "outside what was measured": shown in the caution colour. */
export const SERIOUS_WARNINGS: ReadonlySet<string> = new Set<LookupWarning>([
  "extrapolated",
  "branch-extrapolated",
  "bubble-point-extrapolated",
  "missing-data",
]);

/** The badge label of a warning code as received (e.g. from the API); an unknown code is shown as it is. */
export function warningLabel(code: string): string {
  return Object.hasOwn(WARNING_LABELS, code)
    ? WARNING_LABELS[code as BadgeWarning]
    : code;
}
