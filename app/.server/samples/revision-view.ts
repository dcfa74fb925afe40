import type { OutputSystem, PropertyKey } from "~/core/units";
import { getRevisionDetail } from "~/.server/db/queries/revisions";
import {
  datasetFromCanonicalGrids,
  runQc,
  type CanonicalGridInput,
  type Finding,
} from "~/core/lab-data";
import { qcMetaOf, type SampleForQc } from "./check-upload";
import {
  presentBubblePoints,
  presentFindings,
  presentGrids,
  reportBaseOf,
  type CanonicalGrid,
} from "./present";
import {
  isStoredQcReport,
  orderFindings,
  summarizeFindings,
} from "./qc-report";
import { getRevisionData } from "./revision-data";

/**
 * Everything a page shows about one revision: who uploaded and reviewed it, its grids and bubble points in the
 * reader's units, and its QC findings with the flagged cells. Revisions stored without a QC report (the demo
 * seed) are checked on the fly, and the page says so.
 */
export async function loadRevisionView(
  sample: SampleForQc & { id: number },
  number: number,
  system: OutputSystem,
) {
  const detail = await getRevisionDetail(sample.id, number);
  if (!detail) return null;
  const data = await getRevisionData({
    id: detail.id,
    number: detail.number,
    status: detail.status,
  });
  const grids: CanonicalGrid[] = Object.entries(data.grids).map(([key, g]) => ({
    property: key as PropertyKey,
    sourceUnit: g.sourceUnit,
    pressures: g.pressures,
    temperatures: g.temperatures,
    values: g.values,
  }));
  const report = isStoredQcReport(detail.qcReport) ? detail.qcReport : null;
  let findings: Finding[];
  if (report) {
    findings = orderFindings([...report.fileFindings, ...report.findings]);
  } else {
    const properties: { [K in PropertyKey]?: CanonicalGridInput } = {};
    for (const g of grids)
      properties[g.property] = {
        pressures: g.pressures,
        temperatures: g.temperatures,
        values: g.values,
      };
    const dataset = datasetFromCanonicalGrids({
      properties,
      bubblePoints: data.bubblePoints.map((b) => ({
        temperature: b.temperatureF,
        pressure: b.bubblePointPsia,
      })),
    });
    findings = runQc(dataset, qcMetaOf(sample));
  }
  const { qcReport: _stored, ...revision } = detail;
  void _stored;
  return {
    revision: {
      ...revision,
      createdAt: revision.createdAt.toISOString(),
      reviewedAt: revision.reviewedAt
        ? revision.reviewedAt.toISOString()
        : null,
      ownReview:
        revision.reviewedBy !== null &&
        revision.reviewedBy === revision.createdBy,
    },
    file: report?.file ?? null,
    reportOrigin: report ? ("stored" as const) : ("checked-now" as const),
    summary: summarizeFindings(findings),
    findings: presentFindings(findings, system),
    grids: presentGrids(
      grids,
      data.bubblePoints,
      findings,
      system,
      1,
      reportBaseOf(sample),
    ),
    bubblePoints: presentBubblePoints(data.bubblePoints, findings, system),
  };
}
