import type { UploadPreview } from "~/components/samples/types";
import {
  DEFAULT_BAROMETRIC_PSIA,
  getUnit,
  type OutputSystem,
} from "~/core/units";
import { formatPlain } from "~/core/format";
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
    gaugeNote: gaugeNoteOf(checked),
  };
}

/** The file's gauge pressure units, if any, and the barometric pressure that made them absolute. */
function gaugeNoteOf(checked: Extract<CheckedUpload, { ok: true }>) {
  const gauge = [
    ...new Set(
      Object.values(checked.dataset.properties)
        .map((g) => g.pressureUnit)
        .filter((u) => getUnit("pressure", u.id).gauge)
        .map((u) => u.symbol),
    ),
  ];
  if (gauge.length === 0) return null;
  const barometric = checked.meta.barometricPsia ?? DEFAULT_BAROMETRIC_PSIA;
  return `Gauge pressures (${gauge.join(", ")}) were made absolute with the sample's barometric pressure, ${formatPlain(barometric)} psia; change it on the sample's record if the report states another.`;
}
