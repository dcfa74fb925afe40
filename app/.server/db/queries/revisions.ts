import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/mysql-core";
import type { PropertyKey } from "~/core/units";
import { getDb, type Executor, type Transaction } from "../client";
import {
  gridPoints,
  propertyGrids,
  revisionBubblePoints,
  sampleRevisions,
  users,
  type RevisionStatus,
} from "../schema";
import { recordAudit } from "./audit";
import { lockSample } from "./samples";

/*
 * Revisions of a sample: storing one (as a draft, from an upload), reading its grids, bubble points and history,
 * and the status changes of a review. Every write locks the sample row first (lockSample), so uploads and reviews
 * of one sample run one after the other: numbering stays gapless, only one revision is ever the approved one.
 */

const uploader = alias(users, "uploader");
const reviewer = alias(users, "reviewer");

/*
 * READ COMMITTED: InnoDB then takes no gap locks for the "next number" read (SELECT MAX … FOR UPDATE), which under
 * REPEATABLE READ made two first uploads to neighbouring samples deadlock on the same index gap. Uploads to one
 * sample are serialised by the lock on its row instead.
 */
export const REVISION_WRITE_TX = { isolationLevel: "read committed" } as const;

/** A measured grid in canonical units, in the shape the interpolation engine takes. */
export type StoredGrid = {
  property: PropertyKey;
  unit: string;
  sourceUnit: string | null;
  pressures: number[];
  temperatures: number[];
  values: (number | null)[][];
};

export type NewRevision = {
  sampleId: number;
  status?: RevisionStatus;
  comment?: string | null;
  sourceFilename?: string | null;
  sourceSha256?: string | null;
  qcReport?: unknown;
  createdBy?: number | null;
  reviewedBy?: number | null;
  reviewComment?: string | null;
  bubblePoints: { temperatureF: number; bubblePointPsia: number }[];
  grids: {
    property: PropertyKey;
    unit: string;
    sourceUnit?: string | null;
    pressures: number[];
    temperatures: number[];
    values: (number | null)[][];
  }[];
};

const POINT_BATCH = 1_000;

/**
 * Stores a new revision with its bubble points and grids. Runs in one transaction (its own, or the caller's),
 * takes the next number for the sample under a row lock, so concurrent uploads get unique, gapless numbers.
 */
export async function createRevision(
  input: NewRevision,
  db: Executor = getDb(),
): Promise<{ id: number; number: number }> {
  const run = async (tx: Transaction) => {
    const [row] = await tx
      .select({
        next: sql<number>`COALESCE(MAX(${sampleRevisions.number}), 0) + 1`,
      })
      .from(sampleRevisions)
      .where(eq(sampleRevisions.sampleId, input.sampleId))
      .for("update");
    const number = Number(row?.next ?? 1);
    const [inserted] = await tx
      .insert(sampleRevisions)
      .values({
        sampleId: input.sampleId,
        number,
        status: input.status ?? "draft",
        comment: input.comment ?? null,
        sourceFilename: input.sourceFilename ?? null,
        sourceSha256: input.sourceSha256 ?? null,
        qcReport: input.qcReport ?? null,
        createdBy: input.createdBy ?? null,
        reviewedBy: input.reviewedBy ?? null,
        reviewedAt: input.reviewedBy ? new Date() : null,
        reviewComment: input.reviewComment ?? null,
      })
      .$returningId();
    if (!inserted) throw new Error("revision insert returned no id");
    const revisionId = inserted.id;

    if (input.bubblePoints.length > 0) {
      await tx.insert(revisionBubblePoints).values(
        input.bubblePoints.map((b) => ({
          revisionId,
          temperatureF: b.temperatureF,
          bubblePointPsia: b.bubblePointPsia,
        })),
      );
    }
    for (const grid of input.grids) {
      const [g] = await tx
        .insert(propertyGrids)
        .values({
          revisionId,
          property: grid.property,
          unit: grid.unit,
          sourceUnit: grid.sourceUnit ?? null,
        })
        .$returningId();
      if (!g) throw new Error("grid insert returned no id");
      const points: {
        gridId: number;
        pressurePsia: number;
        temperatureF: number;
        value: number;
      }[] = [];
      grid.pressures.forEach((pressurePsia, i) => {
        grid.temperatures.forEach((temperatureF, j) => {
          const value = grid.values[i]?.[j];
          if (value !== null && value !== undefined)
            points.push({ gridId: g.id, pressurePsia, temperatureF, value });
        });
      });
      for (let k = 0; k < points.length; k += POINT_BATCH) {
        await tx.insert(gridPoints).values(points.slice(k, k + POINT_BATCH));
      }
    }
    return { id: revisionId, number };
  };
  // Inside a caller's transaction this is a savepoint; otherwise a transaction of its own.
  return db.transaction(run);
}

/** Grids of one revision, rebuilt from their points (pressures and temperatures sorted ascending). */
export async function getRevisionGrids(
  revisionId: number,
  db: Executor = getDb(),
): Promise<StoredGrid[]> {
  const grids = await db
    .select({
      id: propertyGrids.id,
      property: propertyGrids.property,
      unit: propertyGrids.unit,
      sourceUnit: propertyGrids.sourceUnit,
    })
    .from(propertyGrids)
    .where(eq(propertyGrids.revisionId, revisionId))
    .orderBy(asc(propertyGrids.property));
  if (grids.length === 0) return [];
  const points = await db
    .select({
      gridId: gridPoints.gridId,
      p: gridPoints.pressurePsia,
      t: gridPoints.temperatureF,
      v: gridPoints.value,
    })
    .from(gridPoints)
    .where(
      inArray(
        gridPoints.gridId,
        grids.map((g) => g.id),
      ),
    );
  return grids.map((g) => {
    const own = points.filter((pt) => pt.gridId === g.id);
    const pressures = [...new Set(own.map((pt) => pt.p))].sort((a, b) => a - b);
    const temperatures = [...new Set(own.map((pt) => pt.t))].sort(
      (a, b) => a - b,
    );
    const pi = new Map(pressures.map((p, i) => [p, i]));
    const ti = new Map(temperatures.map((t, j) => [t, j]));
    const values: (number | null)[][] = pressures.map(() =>
      temperatures.map(() => null),
    );
    for (const pt of own) {
      const row = values[pi.get(pt.p)!];
      if (row) row[ti.get(pt.t)!] = pt.v;
    }
    return {
      property: g.property,
      unit: g.unit,
      sourceUnit: g.sourceUnit,
      pressures,
      temperatures,
      values,
    };
  });
}

export async function listRevisionBubblePoints(
  revisionId: number,
  db: Executor = getDb(),
) {
  return db
    .select({
      temperatureF: revisionBubblePoints.temperatureF,
      bubblePointPsia: revisionBubblePoints.bubblePointPsia,
    })
    .from(revisionBubblePoints)
    .where(eq(revisionBubblePoints.revisionId, revisionId))
    .orderBy(asc(revisionBubblePoints.temperatureF));
}

/** The sample's current revision: its latest approved one, or null. */
export async function getCurrentApprovedRevision(
  sampleId: number,
  db: Executor = getDb(),
) {
  const [row] = await db
    .select({
      id: sampleRevisions.id,
      number: sampleRevisions.number,
      reviewedAt: sampleRevisions.reviewedAt,
    })
    .from(sampleRevisions)
    .where(
      and(
        eq(sampleRevisions.sampleId, sampleId),
        eq(sampleRevisions.status, "approved"),
      ),
    )
    .orderBy(desc(sampleRevisions.number))
    .limit(1);
  return row ?? null;
}

export async function countRevisions(
  sampleId: number,
  db: Executor = getDb(),
): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`COUNT(*)` })
    .from(sampleRevisions)
    .where(eq(sampleRevisions.sampleId, sampleId));
  return Number(row?.n ?? 0);
}

export async function getRevisionByNumber(
  sampleId: number,
  number: number,
  db: Executor = getDb(),
) {
  const [row] = await db
    .select({
      id: sampleRevisions.id,
      number: sampleRevisions.number,
      status: sampleRevisions.status,
      reviewedAt: sampleRevisions.reviewedAt,
      createdAt: sampleRevisions.createdAt,
    })
    .from(sampleRevisions)
    .where(
      and(
        eq(sampleRevisions.sampleId, sampleId),
        eq(sampleRevisions.number, number),
      ),
    );
  return row ?? null;
}

/** Grid ids and properties of many revisions at once (for listings). */
export async function listRevisionProperties(
  revisionIds: number[],
  db: Executor = getDb(),
) {
  if (revisionIds.length === 0) return [];
  return db
    .select({
      revisionId: propertyGrids.revisionId,
      property: propertyGrids.property,
    })
    .from(propertyGrids)
    .where(inArray(propertyGrids.revisionId, revisionIds));
}

export async function listBubblePointsOfRevisions(
  revisionIds: number[],
  db: Executor = getDb(),
) {
  if (revisionIds.length === 0) return [];
  return db
    .select({
      revisionId: revisionBubblePoints.revisionId,
      temperatureF: revisionBubblePoints.temperatureF,
      bubblePointPsia: revisionBubblePoints.bubblePointPsia,
    })
    .from(revisionBubblePoints)
    .where(inArray(revisionBubblePoints.revisionId, revisionIds))
    .orderBy(asc(revisionBubblePoints.temperatureF));
}

type DraftUpload = Omit<
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
  }, REVISION_WRITE_TX);
}

type UploadOutcome =
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
  }, REVISION_WRITE_TX);
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

/** The draft under review, locked for the rest of the transaction, or null. */
export async function getRevisionForReview(
  sampleId: number,
  number: number,
  db: Executor,
) {
  const [row] = await db
    .select({
      id: sampleRevisions.id,
      status: sampleRevisions.status,
      createdBy: sampleRevisions.createdBy,
      qcReport: sampleRevisions.qcReport,
    })
    .from(sampleRevisions)
    .where(
      and(
        eq(sampleRevisions.sampleId, sampleId),
        eq(sampleRevisions.number, number),
      ),
    )
    .for("update");
  return row ?? null;
}

type ReviewStamp = {
  reviewerId: number;
  comment: string | null;
  at: Date;
};

export async function rejectRevision(
  revisionId: number,
  stamp: ReviewStamp,
  db: Executor,
) {
  await db
    .update(sampleRevisions)
    .set({
      status: "rejected",
      reviewedBy: stamp.reviewerId,
      reviewedAt: stamp.at,
      reviewComment: stamp.comment,
    })
    .where(eq(sampleRevisions.id, revisionId));
}

/** Approves the revision; the sample's previously approved revision becomes superseded. */
export async function approveRevision(
  sampleId: number,
  revisionId: number,
  stamp: ReviewStamp,
  db: Executor,
) {
  await db
    .update(sampleRevisions)
    .set({ status: "superseded" })
    .where(
      and(
        eq(sampleRevisions.sampleId, sampleId),
        eq(sampleRevisions.status, "approved"),
      ),
    );
  await db
    .update(sampleRevisions)
    .set({
      status: "approved",
      reviewedBy: stamp.reviewerId,
      reviewedAt: stamp.at,
      reviewComment: stamp.comment,
    })
    .where(eq(sampleRevisions.id, revisionId));
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
