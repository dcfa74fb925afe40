import {
  countFollowers,
  followSample,
  isFollowing,
  unfollowSample,
} from "~/.server/db/queries/follows";
import { listRevisionsOfSample } from "~/.server/db/queries/revisions";
import type { getSampleWithPlace } from "~/.server/db/queries/samples";
import type { OutputSystem } from "~/core/units";
import type { RevisionHistoryRow } from "~/components/samples/revision-types";
import type {
  SampleRecordView,
  SampleUnits,
} from "~/components/samples/sample-record";
import { can, type Role } from "~/utils/permissions";
import { presentSample } from "./present";
import { loadRevisionView } from "./revision-view";

type SampleWithPlace = NonNullable<
  Awaited<ReturnType<typeof getSampleWithPlace>>
>;

/**
 * What the sample page shows: the record in the reader's units (from the one presenter, formatted on the
 * page), every revision newest first, the approved revision's tables and QC findings, who follows the sample
 * and what the reader may do.
 */
export async function loadSamplePage(
  sample: SampleWithPlace,
  user: { id: number; role: Role; unitSystem: OutputSystem },
) {
  const system = user.unitSystem;
  const [revisions, following, followers] = await Promise.all([
    listRevisionsOfSample(sample.id),
    isFollowing(sample.id, user.id),
    countFollowers(sample.id),
  ]);
  const current = revisions.find((r) => r.status === "approved") ?? null;
  const view = current
    ? await loadRevisionView(sample, current.number, system)
    : null;
  const shown = presentSample(sample, system);
  const record: SampleRecordView = {
    id: sample.id,
    label: sample.label,
    fieldName: sample.fieldName,
    wellName: sample.wellName,
    sampleType: sample.sampleType,
    samplingDate: sample.samplingDate,
    depth: shown.samplingDepth,
    reservoirPressure: shown.reservoirPressure,
    reservoirTemperature: shown.reservoirTemperature,
    stockTankApi: sample.stockTankApi,
    gasSpecificGravity: sample.gasSpecificGravity,
    standardConditions: shown.standardConditions?.label ?? null,
    barometricPressure: shown.barometricPressure,
    laboratory: sample.laboratory,
    reportReference: sample.reportReference,
    notes: sample.notes,
  };
  const units: SampleUnits = shown.units;
  return {
    sample: record,
    units,
    revisions: revisions.map((r): RevisionHistoryRow => ({
      number: r.number,
      status: r.status,
      comment: r.comment,
      sourceFilename: r.sourceFilename,
      createdAt: r.createdAt.toISOString(),
      uploaderName: r.uploaderName,
      reviewedAt: r.reviewedAt ? r.reviewedAt.toISOString() : null,
      reviewerName: r.reviewerName,
      ownReview: r.reviewedBy !== null && r.reviewedBy === r.createdBy,
      qcStatus: r.qcStatus,
    })),
    current: view,
    following,
    followers,
    can: {
      edit: can(user, "edit:samples"),
      upload: can(user, "upload:revisions"),
      review: can(user, "review:revisions"),
    },
  };
}

/** Follows or unfollows the sample; returns what the page says about it. */
export async function changeFollowing(
  sampleId: number,
  userId: number,
  intent: "follow" | "unfollow",
): Promise<string> {
  if (intent === "follow") {
    await followSample(sampleId, userId);
    return "You follow this sample: you will get an e-mail when a new revision is approved.";
  }
  await unfollowSample(sampleId, userId);
  return "You no longer follow this sample.";
}
