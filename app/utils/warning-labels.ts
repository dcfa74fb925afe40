/** Short labels for the warning badges of lookup results; the full sentence comes from describeWarningCode. */
export const WARNING_LABELS: Record<string, string> = {
  extrapolated: "extrapolated",
  "degree-reduced": "lower degree",
  "missing-data": "missing cells",
  overshoot: "overshoot",
  "branch-extrapolated": "past a column's bubble point",
  "bubble-point-extrapolated": "bubble point extrapolated",
  "bubble-point-unknown": "bubble point unknown",
  "pchip-fallback": "pchip used (overshoot)",
  "near-bubble-point": "near the bubble point",
};

/** Warnings that mean "outside what was measured": shown in the caution colour. */
export const SERIOUS_WARNINGS = new Set(["extrapolated", "branch-extrapolated", "bubble-point-extrapolated", "missing-data"]);

/** Within this fraction of the bubble point a value is flagged: the kink is close. Common practice, not a standard. */
export const NEAR_BUBBLE_POINT_FRACTION = 0.02;
