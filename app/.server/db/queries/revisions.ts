import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import type { PropertyKey } from "~/core/units";
import { getDb, type Executor, type Transaction } from "../client";
import {
  gridPoints,
  propertyGrids,
  revisionBubblePoints,
  sampleRevisions,
  type RevisionStatus,
} from "../schema";

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
