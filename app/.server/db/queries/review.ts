import { and, asc, desc, eq, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/mysql-core";
import { isStoredQcReport, summarizeReport } from "~/.server/samples/qc-report";
import { getDb, type Executor } from "../client";
import {
  sampleFollows,
  sampleRevisions,
  samples,
  users,
  type RevisionStatus,
} from "../schema";
import { recordAudit } from "./audit";
import { getFourEyesPolicy } from "./settings";
import {
  createRevision,
  getRevisionGrids,
  listRevisionBubblePoints,
  type NewRevision,
} from "./revisions";

/*
 * The life of a revision after the upload parser: storing it as a draft, approving or rejecting it, following a
 * sample, and reading two revisions for a diff. Every write locks the sample row first, so uploads and reviews of
 * one sample run one after the other (numbering stays gapless, only one revision is ever the approved one).
 */

const uploader = alias(users, "uploader");
const reviewer = alias(users, "reviewer");

/*
 * READ COMMITTED: InnoDB then takes no gap locks for the "next number" read (SELECT MAX … FOR UPDATE), which under
 * REPEATABLE READ made two first uploads to neighbouring samples deadlock on the same index gap. Uploads to one
 * sample are serialised by the lock on its row instead.
 */
const WRITE_TX = { isolationLevel: "read committed" } as const;

/** Locks the sample row for the rest of the transaction; false when there is no such sample. */
async function lockSample(sampleId: number, db: Executor): Promise<boolean> {
  const [row] = await db
    .select({ id: samples.id })
    .from(samples)
    .where(eq(samples.id, sampleId))
    .for("update");
  return !!row;
}

export type DraftUpload = Omit<
  NewRevision,
  "status" | "reviewedBy" | "reviewComment"
> & {
  createdBy: number;
  ipAddress?: string | null;
  auditDetails?: Record<string, unknown>;
};

/** The newest revision of the sample whose uploaded file had this SHA-256, with who uploaded it and when. */
export async function findIdenticalRevision(
  sampleId: number,
  sha256: string,
  db: Executor = getDb(),
): Promise<IdenticalRevision | null> {
  const [row] = await db
    .select({
      number: sampleRevisions.number,
      status: sampleRevisions.status,
      uploaderName: uploader.name,
      createdAt: sampleRevisions.createdAt,
    })
    .from(sampleRevisions)
    .leftJoin(uploader, eq(uploader.id, sampleRevisions.createdBy))
    .where(
      and(
        eq(sampleRevisions.sampleId, sampleId),
        eq(sampleRevisions.sourceSha256, sha256),
      ),
    )
    .orderBy(desc(sampleRevisions.number))
    .limit(1);
  return row ?? null;
}

export type IdenticalRevision = {
  number: number;
  status: RevisionStatus;
  uploaderName: string | null;
  createdAt: Date;
};

async function insertDraft(
  input: DraftUpload,
  tx: Executor,
): Promise<{ id: number; number: number }> {
  const { ipAddress, auditDetails, ...revision } = input;
  const stored = await createRevision({ ...revision, status: "draft" }, tx);
  await recordAudit(
    {
      action: "revision_uploaded",
      userId: input.createdBy,
      entityType: "sample_revision",
      entityId: stored.id,
      details: {
        sampleId: revision.sampleId,
        number: stored.number,
        file: revision.sourceFilename ?? null,
        ...auditDetails,
      },
      ipAddress: ipAddress ?? null,
    },
    tx,
  );
  return stored;
}

/** Stores an uploaded revision as a draft and records the upload in the audit log, all in one transaction. */
export async function storeDraftRevision(
  input: DraftUpload,
  db: Executor = getDb(),
): Promise<{ id: number; number: number }> {
  return db.transaction(async (tx) => {
    if (!(await lockSample(input.sampleId, tx)))
      throw new Error(`sample ${input.sampleId} does not exist`);
    return insertDraft(input, tx);
  }, WRITE_TX);
}

export type UploadOutcome =
  | { ok: true; id: number; number: number }
  | { ok: false; reason: "identical"; identical: IdenticalRevision }
  | { ok: false; reason: "sample_gone" };

/**
 * The upload page's store: like storeDraftRevision, but a file identical (same SHA-256) to one already stored
 * for the sample is refused unless the uploader confirmed it (`storeIdentical`). Checked after the sample row is
 * locked, so two identical uploads at once cannot both slip past.
 */
export async function storeUploadedRevision(
  input: DraftUpload & { storeIdentical: boolean },
  db: Executor = getDb(),
): Promise<UploadOutcome> {
  const { storeIdentical, ...draft } = input;
  return db.transaction(async (tx): Promise<UploadOutcome> => {
    if (!(await lockSample(draft.sampleId, tx)))
      return { ok: false, reason: "sample_gone" };
    if (draft.sourceSha256 && !storeIdentical) {
      const identical = await findIdenticalRevision(
        draft.sampleId,
        draft.sourceSha256,
        tx,
      );
      if (identical) return { ok: false, reason: "identical", identical };
    }
    const stored = await insertDraft(
      {
        ...draft,
        auditDetails: {
          ...draft.auditDetails,
          ...(storeIdentical ? { storedIdentical: true } : {}),
        },
      },
      tx,
    );
    return { ok: true, ...stored };
  }, WRITE_TX);
}

const revisionColumns = {
  id: sampleRevisions.id,
  sampleId: sampleRevisions.sampleId,
  number: sampleRevisions.number,
  status: sampleRevisions.status,
  comment: sampleRevisions.comment,
  sourceFilename: sampleRevisions.sourceFilename,
  sourceSha256: sampleRevisions.sourceSha256,
  createdAt: sampleRevisions.createdAt,
  createdBy: sampleRevisions.createdBy,
  uploaderName: uploader.name,
  reviewedAt: sampleRevisions.reviewedAt,
  reviewedBy: sampleRevisions.reviewedBy,
  reviewerName: reviewer.name,
  reviewComment: sampleRevisions.reviewComment,
};

const QC_STATUSES = ["pass", "warn", "fail"] as const;

/** Every revision of a sample, newest first, with who uploaded and who reviewed it and the QC status. */
export async function listRevisionsOfSample(
  sampleId: number,
  db: Executor = getDb(),
) {
  const rows = await db
    .select({
      ...revisionColumns,
      qcStatus: sql<
        string | null
      >`json_unquote(json_extract(${sampleRevisions.qcReport}, '$.status'))`,
    })
    .from(sampleRevisions)
    .leftJoin(uploader, eq(uploader.id, sampleRevisions.createdBy))
    .leftJoin(reviewer, eq(reviewer.id, sampleRevisions.reviewedBy))
    .where(eq(sampleRevisions.sampleId, sampleId))
    .orderBy(desc(sampleRevisions.number));
  return rows.map((r) => ({
    ...r,
    qcStatus: QC_STATUSES.find((s) => s === r.qcStatus) ?? null,
  }));
}

/** One revision with its QC report, or null. */
export async function getRevisionDetail(
  sampleId: number,
  number: number,
  db: Executor = getDb(),
) {
  const [row] = await db
    .select({ ...revisionColumns, qcReport: sampleRevisions.qcReport })
    .from(sampleRevisions)
    .leftJoin(uploader, eq(uploader.id, sampleRevisions.createdBy))
    .leftJoin(reviewer, eq(reviewer.id, sampleRevisions.reviewedBy))
    .where(
      and(
        eq(sampleRevisions.sampleId, sampleId),
        eq(sampleRevisions.number, number),
      ),
    );
  return row ?? null;
}

export type ReviewDecision = {
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
  db: Executor = getDb(),
): Promise<ReviewOutcome> {
  return db.transaction(async (tx): Promise<ReviewOutcome> => {
    if (!(await lockSample(input.sampleId, tx)))
      return { ok: false, reason: "not_found" };
    const [revision] = await tx
      .select({
        id: sampleRevisions.id,
        status: sampleRevisions.status,
        createdBy: sampleRevisions.createdBy,
        qcReport: sampleRevisions.qcReport,
      })
      .from(sampleRevisions)
      .where(
        and(
          eq(sampleRevisions.sampleId, input.sampleId),
          eq(sampleRevisions.number, input.number),
        ),
      )
      .for("update");
    if (!revision) return { ok: false, reason: "not_found" };
    if (revision.status !== "draft")
      return { ok: false, reason: "not_draft", status: revision.status };
    const ownUpload = revision.createdBy === input.reviewerId;
    const now = new Date();
    const fourEyes =
      input.decision === "approve" ? await getFourEyesPolicy(tx) : null;
    if (fourEyes?.required && ownUpload)
      return { ok: false, reason: "own_upload" };

    if (input.decision === "reject") {
      await tx
        .update(sampleRevisions)
        .set({
          status: "rejected",
          reviewedBy: input.reviewerId,
          reviewedAt: now,
          reviewComment: input.comment,
        })
        .where(eq(sampleRevisions.id, revision.id));
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

    const [previous] = await tx
      .select({ id: sampleRevisions.id, number: sampleRevisions.number })
      .from(sampleRevisions)
      .where(
        and(
          eq(sampleRevisions.sampleId, input.sampleId),
          eq(sampleRevisions.status, "approved"),
        ),
      )
      .orderBy(desc(sampleRevisions.number))
      .limit(1);
    await tx
      .update(sampleRevisions)
      .set({ status: "superseded" })
      .where(
        and(
          eq(sampleRevisions.sampleId, input.sampleId),
          eq(sampleRevisions.status, "approved"),
        ),
      );
    await tx
      .update(sampleRevisions)
      .set({
        status: "approved",
        reviewedBy: input.reviewerId,
        reviewedAt: now,
        reviewComment: input.comment,
      })
      .where(eq(sampleRevisions.id, revision.id));
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
  }, WRITE_TX);
}

export async function isFollowing(
  sampleId: number,
  userId: number,
  db: Executor = getDb(),
): Promise<boolean> {
  const [row] = await db
    .select({ id: sampleFollows.id })
    .from(sampleFollows)
    .where(
      and(
        eq(sampleFollows.sampleId, sampleId),
        eq(sampleFollows.userId, userId),
      ),
    );
  return !!row;
}

/** Follow (idempotent). */
export async function followSample(
  sampleId: number,
  userId: number,
  db: Executor = getDb(),
): Promise<void> {
  await db
    .insert(sampleFollows)
    .values({ sampleId, userId })
    .onDuplicateKeyUpdate({ set: { sampleId } });
}

export async function unfollowSample(
  sampleId: number,
  userId: number,
  db: Executor = getDb(),
): Promise<void> {
  await db
    .delete(sampleFollows)
    .where(
      and(
        eq(sampleFollows.sampleId, sampleId),
        eq(sampleFollows.userId, userId),
      ),
    );
}

export async function countFollowers(
  sampleId: number,
  db: Executor = getDb(),
): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)` })
    .from(sampleFollows)
    .where(eq(sampleFollows.sampleId, sampleId));
  return Number(row?.n ?? 0);
}

/** People following the sample whose accounts are active (for the approval e-mail). */
export async function listActiveFollowers(
  sampleId: number,
  db: Executor = getDb(),
) {
  return db
    .select({ id: users.id, email: users.email, name: users.name })
    .from(sampleFollows)
    .innerJoin(users, eq(users.id, sampleFollows.userId))
    .where(
      and(
        eq(sampleFollows.sampleId, sampleId),
        sql`${users.disabledAt} is null`,
      ),
    )
    .orderBy(asc(users.email));
}

/** Both revisions of a diff with their grids and bubble points (canonical units), or null for a missing one. */
export async function getRevisionsForDiff(
  sampleId: number,
  from: number,
  to: number,
  db: Executor = getDb(),
) {
  const load = async (number: number) => {
    const [row] = await db
      .select({
        id: sampleRevisions.id,
        number: sampleRevisions.number,
        status: sampleRevisions.status,
        createdAt: sampleRevisions.createdAt,
      })
      .from(sampleRevisions)
      .where(
        and(
          eq(sampleRevisions.sampleId, sampleId),
          eq(sampleRevisions.number, number),
        ),
      );
    if (!row) return null;
    const [grids, bubblePoints] = await Promise.all([
      getRevisionGrids(row.id, db),
      listRevisionBubblePoints(row.id, db),
    ]);
    return { ...row, grids, bubblePoints };
  };
  const [a, b] = await Promise.all([load(from), load(to)]);
  return { from: a, to: b };
}
