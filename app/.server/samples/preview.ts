import type { UploadPreview } from "~/components/samples/types";
import type { OutputSystem } from "~/core/units";
import {
  bubblePointsOf,
  canonicalGridsOf,
  type CheckedUpload,
} from "./check-upload";
import { presentBubblePoints, presentFindings, presentGrids } from "./present";
import { orderFindings, summarizeFindings } from "./qc-report";

/** What the upload page shows before anything is stored: the parsed grids, the QC findings, the flagged cells. */
export function buildPreview(
  checked: Extract<CheckedUpload, { ok: true }>,
  system: OutputSystem,
): UploadPreview {
  const findings = orderFindings([
    ...checked.fileFindings,
    ...checked.findings,
  ]);
  const grids = canonicalGridsOf(checked.dataset);
  const bubblePoints = bubblePointsOf(checked.dataset);
  const file = checked.dataset.file;
  const temperatures = new Set(grids.flatMap((g) => g.temperatures));
  const pressures = new Set(grids.flatMap((g) => g.pressures));
  return {
    fileName: checked.fileName,
    sha256: checked.sha256,
    sizeBytes: checked.sizeBytes,
    format: file?.format ?? "csv",
    layout: file?.layout ?? "long",
    sheets: file?.sheets ? [...file.sheets] : null,
    counts: {
      properties: grids.length,
      temperatures: temperatures.size,
      pressures: pressures.size,
      cells: grids.reduce(
        (n, g) => n + g.values.flat().filter((v) => v !== null).length,
        0,
      ),
    },
    summary: summarizeFindings(findings),
    findings: presentFindings(findings, system),
    grids: presentGrids(
      grids,
      bubblePoints,
      findings,
      system,
      1,
      checked.meta.standardConditions,
    ),
    bubblePoints: presentBubblePoints(bubblePoints, findings, system),
  };
}
