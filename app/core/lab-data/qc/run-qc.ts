/**
 * runQc: the physical checks of a parsed dataset, pure and deterministic. Returns findings sorted by
 * severity (errors, then warnings, then notes); never throws. Rules and sources: rules.ts and README.md.
 */
import type { Finding, ParsedDataset, Severity } from "../types";
import { QcContext, type QcMeta } from "./context";
import {
  checkDensityMassBalance,
  checkGasConsistency,
  checkSaturatedConsistency,
} from "./consistency";
import { checkCorrelations } from "./correlations";
import { checkOutliers } from "./outliers";
import { checkRanges } from "./ranges";
import { checkGridShapes, resolveBubblePoints } from "./shape-and-bubble";
import { checkPressureTrends } from "./trends";

const ORDER: Readonly<Record<Severity, number>> = {
  error: 0,
  warning: 1,
  info: 2,
};

export function runQc(dataset: ParsedDataset, meta: QcMeta = {}): Finding[] {
  const ctx = new QcContext(dataset, meta ?? {});
  const steps = [
    checkGridShapes,
    resolveBubblePoints,
    checkRanges,
    checkPressureTrends,
    checkSaturatedConsistency,
    checkGasConsistency,
    checkDensityMassBalance,
    checkOutliers,
    checkCorrelations,
  ];
  for (const step of steps) {
    try {
      step(ctx);
    } catch {
      ctx.findings.push({
        code: "INVALID_GRID",
        severity: "error",
        rule: "grid-shape",
        message:
          "The checks could not finish on this dataset because of an error in Isopleth itself; please report it with the file.",
        cells: [],
      });
      break;
    }
  }
  ctx.summarizeDropped();
  return ctx.findings
    .map((f, i) => ({ f, i }))
    .sort((a, b) => ORDER[a.f.severity] - ORDER[b.f.severity] || a.i - b.i)
    .map(({ f }) => f);
}

/** Summary for a revision: "fail" if any error, "warn" if any warning, else "pass". */
export function qcStatus(
  findings: readonly Finding[],
): "fail" | "warn" | "pass" {
  if (findings.some((f) => f.severity === "error")) return "fail";
  if (findings.some((f) => f.severity === "warning")) return "warn";
  return "pass";
}
