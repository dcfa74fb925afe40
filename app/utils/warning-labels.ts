import type { LookupWarning } from "~/core/lookup";

/**
 * Short labels for the warning badges of lookup results; the full sentence comes from describeWarningCode.
 * Keyed by the one list of lookup warning codes (app/core/lookup/warnings.ts, all computed on the server,
 * near-bubble-point included), so a code added or renamed in app/core fails the type check here.
 */
export const WARNING_LABELS: Record<LookupWarning, string> = {
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
  "near-bubble-point": "near the bubble point",
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
    ? WARNING_LABELS[code as LookupWarning]
    : code;
}
