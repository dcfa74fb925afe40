import { getDb, type Database } from "~/.server/db/client";
import { recordAudit } from "~/.server/db/queries/audit";
import {
  approveRevision,
  getCurrentApprovedRevision,
  getRevisionForReview,
  rejectRevision,
  REVISION_WRITE_TX,
} from "~/.server/db/queries/revisions";
import { lockSample } from "~/.server/db/queries/samples";
import { getFourEyesPolicy } from "~/.server/db/queries/settings";
import { isStoredQcReport, summarizeReport } from "./qc-report";

/*
 * Reviewing a draft revision: the rules of approval (four-eyes, QC errors block it, warnings need acknowledging)
 * checked and applied in one transaction that holds the sample's row lock, with the decision's audit row.
 */

type ReviewDecision = {
  sampleId: number;
  number: number;
  decision: "approve" | "reject";
  reviewerId: number;
  comment: string | null;
  /** The reviewer ticked "I have read the warnings". */
  acknowledgedWarnings: boolean;
  ipAddress?: string | null;
};

export type ReviewOutcome =
  | {
      ok: true;
      revisionId: number;
      previousApproved: number | null;
      ownUpload: boolean;
    }
  /** own_upload: four-eyes approval is on and the reviewer uploaded the revision. */
  | {
      ok: false;
      reason:
        | "not_found"
        | "not_draft"
        | "own_upload"
        | "qc_errors"
        | "no_qc_report"
        | "warnings_not_acknowledged";
      status?: string;
    };

/**
 * Approves or rejects a draft in one transaction. Approval is refused while the QC report holds errors, and
 * needs the warnings acknowledged; the previously approved revision becomes superseded. Both are audited.
 */
export async function reviewRevision(
  input: ReviewDecision,
  db: Database = getDb(),
): Promise<ReviewOutcome> {
  return db.transaction(async (tx): Promise<ReviewOutcome> => {
    if (!(await lockSample(input.sampleId, tx)))
      return { ok: false, reason: "not_found" };
    const revision = await getRevisionForReview(
      input.sampleId,
      input.number,
      tx,
    );
    if (!revision) return { ok: false, reason: "not_found" };
    if (revision.status !== "draft")
      return { ok: false, reason: "not_draft", status: revision.status };
    const ownUpload = revision.createdBy === input.reviewerId;
    const stamp = {
      reviewerId: input.reviewerId,
      comment: input.comment,
      at: new Date(),
    };
    const fourEyes =
      input.decision === "approve" ? await getFourEyesPolicy(tx) : null;
    if (fourEyes?.required && ownUpload)
      return { ok: false, reason: "own_upload" };

    if (input.decision === "reject") {
      await rejectRevision(revision.id, stamp, tx);
      await recordAudit(
        {
          action: "revision_rejected",
          userId: input.reviewerId,
          entityType: "sample_revision",
          entityId: revision.id,
          details: {
            sampleId: input.sampleId,
            number: input.number,
            ownUpload,
            comment: input.comment,
          },
          ipAddress: input.ipAddress ?? null,
        },
        tx,
      );
      return {
        ok: true,
        revisionId: revision.id,
        previousApproved: null,
        ownUpload,
      };
    }

    const report = isStoredQcReport(revision.qcReport)
      ? revision.qcReport
      : null;
    if (!report) return { ok: false, reason: "no_qc_report" };
    const summary = summarizeReport(report);
    if (summary.errors > 0) return { ok: false, reason: "qc_errors" };
    if (summary.warnings > 0 && !input.acknowledgedWarnings)
      return { ok: false, reason: "warnings_not_acknowledged" };

    const previous = await getCurrentApprovedRevision(input.sampleId, tx);
    await approveRevision(input.sampleId, revision.id, stamp, tx);
    await recordAudit(
      {
        action: "revision_approved",
        userId: input.reviewerId,
        entityType: "sample_revision",
        entityId: revision.id,
        details: {
          sampleId: input.sampleId,
          number: input.number,
          superseded: previous?.number ?? null,
          ownUpload,
          fourEyes: fourEyes?.required ?? false,
          qcStatus: summary.status,
          acknowledgedWarnings:
            summary.warnings > 0 ? input.acknowledgedWarnings : undefined,
          comment: input.comment,
        },
        ipAddress: input.ipAddress ?? null,
      },
      tx,
    );
    return {
      ok: true,
      revisionId: revision.id,
      previousApproved: previous?.number ?? null,
      ownUpload,
    };
  }, REVISION_WRITE_TX);
}
