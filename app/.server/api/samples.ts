import {
  getSampleWithPlace,
  listSamplesWithApproved,
} from "~/.server/db/queries/samples";
import {
  listBubblePointsOfRevisions,
  listRevisionProperties,
} from "~/.server/db/queries/revisions";
import { problem } from "~/.server/http";
import {
  getRevisionData,
  resolveRevision,
  type RevisionData,
} from "~/.server/samples/revision-data";
import {
  gridInOutputUnits,
  outputPressure,
  presentSample,
  reportBaseOf,
} from "~/.server/samples/present";
import { standardLabel } from "~/.server/samples/sample-input";
import {
  outputUnitSystem,
  type OutputSystem,
  type PropertyKey,
  type ReferenceConditions,
  unitLabel,
} from "~/core/units";
import type { RevisionStatus } from "~/utils/sample-vocabulary";
import {
  callerMayReadDrafts,
  callerMayReadSample,
  type ApiCaller,
} from "./caller";

/*
 * What the API serves about samples. Every number in output units comes from the one presenter,
 * app/.server/samples/present.ts, and follows its one rounding rule (10 significant digits), on every route.
 */

/** The units block of a response: the system and its pressure and temperature symbols. */
export function unitsBlock(system: OutputSystem) {
  return {
    system,
    pressure: unitLabel(system, "pressure"),
    temperature: unitLabel(system, "temperature"),
  };
}

export async function listSamplesForCaller(
  caller: ApiCaller,
  system: OutputSystem,
) {
  const all = (await listSamplesWithApproved()).filter((s) =>
    callerMayReadSample(caller, { id: s.id, fieldId: s.fieldId }),
  );
  const revisionIds = new Map<number, number>();
  for (const s of all)
    if (s.approvedRevisionId !== null)
      revisionIds.set(s.id, Number(s.approvedRevisionId));
  const ids = [...revisionIds.values()];
  const [props, bubbles] = await Promise.all([
    listRevisionProperties(ids),
    listBubblePointsOfRevisions(ids),
  ]);
  return all.map((s) => {
    const rid = revisionIds.get(s.id);
    const shown = presentSample(
      s,
      system,
      bubbles.filter((b) => b.revisionId === rid),
    );
    return {
      id: s.id,
      label: s.label,
      field: s.fieldName,
      well: s.wellName,
      sampleType: s.sampleType,
      reservoirTemperature: shown.reservoirTemperature,
      reservoirPressure: shown.reservoirPressure,
      bubblePoint: shown.bubblePoint,
      approvedRevision:
        s.approvedRevision === null ? null : Number(s.approvedRevision),
      properties: props
        .filter((p) => p.revisionId === rid)
        .map((p) => p.property as PropertyKey),
    };
  });
}

/** The sample the caller asked for, or a thrown 404/403 problem. */
export async function requireSampleForCaller(
  caller: ApiCaller,
  sampleId: number,
) {
  const sample = await getSampleWithPlace(sampleId);
  if (!sample)
    throw problem(404, "sample_not_found", `There is no sample ${sampleId}.`);
  if (
    !callerMayReadSample(caller, { id: sample.id, fieldId: sample.fieldId })
  ) {
    throw problem(
      403,
      "outside_restriction",
      `This token is restricted to other samples or fields than sample ${sampleId}.`,
    );
  }
  return sample;
}

/** Statuses of revisions that were approved (a superseded revision was approved and stays citable). */
const APPROVED_STATUSES: ReadonlySet<string> = new Set<RevisionStatus>([
  "approved",
  "superseded",
]);

export const isApprovedStatus = (status: string) =>
  APPROVED_STATUSES.has(status);

/**
 * The revision's data, or a thrown 404 problem (no approved revision, or no such revision number). The
 * sample row already names its latest approved revision, so the common case needs no further query.
 * Drafts stay drafts: an unapproved revision (draft or rejected) is served only to a signed-in person whose
 * role may read drafts and who asked for it by number; anyone else (every token) gets the same 404 as for a
 * number that does not exist, so unreleased work is neither served nor revealed.
 */
export async function requireRevisionData(
  caller: ApiCaller,
  sample: {
    id: number;
    approvedRevisionId: number | null;
    approvedRevisionNumber: number | null;
  },
  number?: number,
): Promise<RevisionData> {
  const sampleId = sample.id;
  const found =
    number === undefined &&
    sample.approvedRevisionId !== null &&
    sample.approvedRevisionNumber !== null
      ? {
          id: Number(sample.approvedRevisionId),
          number: Number(sample.approvedRevisionNumber),
          status: "approved",
        }
      : await resolveRevision(sampleId, number);
  const revision =
    found && (isApprovedStatus(found.status) || callerMayReadDrafts(caller))
      ? found
      : null;
  if (!revision) {
    throw number === undefined
      ? problem(
          404,
          "no_approved_revision",
          `Sample ${sampleId} has no approved revision yet.`,
        )
      : problem(
          404,
          "revision_not_found",
          `Sample ${sampleId} has no revision ${number} that you may read.`,
        );
  }
  return getRevisionData(revision);
}

/** How an output names an unapproved revision (a CSV or text header line, the page banner). */
export function draftWarning(
  data: { number: number; status: string },
  sampleId: number,
): string | null {
  if (isApprovedStatus(data.status)) return null;
  return `UNAPPROVED ${data.status.toUpperCase()}: revision ${data.number} of sample ${sampleId} has not been approved (status ${data.status}); its checks may have failed. Do not use it for decisions.`;
}

/** The revision's grids in output units; Rs and Bg rebased from the report's base (`reported`) to the output's. */
export function gridsForOutput(
  data: RevisionData,
  system: OutputSystem,
  reported: ReferenceConditions,
) {
  return Object.entries(data.grids).map(([key, grid]) => {
    const property = key as PropertyKey;
    return {
      property,
      unit: unitLabel(system, property),
      laboratoryUnit: grid.sourceUnit,
      ...gridInOutputUnits({ ...grid, property }, system, reported),
      ...(grid.bubblePoints
        ? {
            bubblePoints: grid.bubblePoints.map((b) =>
              b === null ? null : outputPressure(b, system),
            ),
          }
        : {}),
    };
  });
}

type SampleRecord = NonNullable<Awaited<ReturnType<typeof getSampleWithPlace>>>;

/** The body of GET /api/v1/samples/:sampleId: the sample's record and the revision's data in output units. */
export function sampleDetailForOutput(
  sample: SampleRecord,
  data: RevisionData,
  system: OutputSystem,
) {
  const shown = presentSample(sample, system, data.bubblePoints);
  return {
    sample: {
      id: sample.id,
      label: sample.label,
      field: sample.fieldName,
      well: sample.wellName,
      sampleType: sample.sampleType,
      samplingDate: sample.samplingDate,
      samplingDepthFt: sample.samplingDepthFt,
      reservoirPressure: shown.reservoirPressure,
      reservoirTemperature: shown.reservoirTemperature,
      stockTankApi: sample.stockTankApi,
      gasSpecificGravity: sample.gasSpecificGravity,
      standardConditions: {
        pressurePsia: sample.standardPressurePsia,
        temperatureF: sample.standardTemperatureF,
      },
      barometricPressurePsia: sample.barometricPressurePsia,
      laboratory: sample.laboratory,
      reportReference: sample.reportReference,
    },
    revision: {
      number: data.number,
      status: data.status,
      approved: isApprovedStatus(data.status),
    },
    units: {
      ...unitsBlock(system),
      standardConditions: outputUnitSystem(system).standardConditions.label,
      reportStandardConditions: standardLabel(sample),
    },
    bubblePoints: shown.bubblePoints,
    grids: gridsForOutput(data, system, reportBaseOf(sample)),
  };
}
