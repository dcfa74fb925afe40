import {
  and,
  asc,
  count,
  desc,
  eq,
  like,
  or,
  sql,
  TransactionRollbackError,
  type SQL,
  type SQLWrapper,
} from "drizzle-orm";
import { getDb, type Executor } from "../client";
import {
  fields,
  sampleRevisions,
  samples,
  wells,
  type SampleType,
} from "../schema";
import { recordAudit } from "./audit";

/*
 * Samples (each in a well of a field): create, edit, read one with its place, list and search them.
 * Values are in canonical units (psia, °F, ft); conversion to the reader's unit system happens above this layer.
 */

/** The sample's own columns: selected by every read of a whole sample, written by create and edit. */
const SAMPLE_COLUMNS = {
  id: samples.id,
  label: samples.label,
  sampleType: samples.sampleType,
  samplingDate: samples.samplingDate,
  samplingDepthFt: samples.samplingDepthFt,
  reservoirPressurePsia: samples.reservoirPressurePsia,
  reservoirTemperatureF: samples.reservoirTemperatureF,
  stockTankApi: samples.stockTankApi,
  gasSpecificGravity: samples.gasSpecificGravity,
  standardPressurePsia: samples.standardPressurePsia,
  standardTemperatureF: samples.standardTemperatureF,
  barometricPressurePsia: samples.barometricPressurePsia,
  laboratory: samples.laboratory,
  reportReference: samples.reportReference,
  notes: samples.notes,
};

/** The id of the latest approved revision of the sample of the row (a correlated subquery). */
const latestApprovedRevision = (column: "id" | "number") =>
  sql<
    number | null
  >`(SELECT r.${sql.raw(column)} FROM sample_revisions r WHERE r.sample_id = ${samples.id} AND r.status = 'approved' ORDER BY r.number DESC LIMIT 1)`;

/** The editable part of a sample, with its field and well given by name (created when new). */
export type SampleRecordInput = {
  fieldName: string;
  fieldRegion?: string | null;
  wellName: string;
  label: string;
  sampleType: SampleType;
  samplingDate: string | null;
  samplingDepthFt: number | null;
  reservoirPressurePsia: number | null;
  reservoirTemperatureF: number | null;
  stockTankApi: number | null;
  gasSpecificGravity: number | null;
  standardPressurePsia: number;
  standardTemperatureF: number;
  /** Barometric pressure of the report's gauge readings, psia; left out: 14.696 for a new sample, unchanged on edit. */
  barometricPressurePsia?: number;
  laboratory: string | null;
  reportReference: string | null;
  notes: string | null;
};

/** No gap locks for the find-or-create reads (see revisions.ts); the unique keys still refuse duplicates. */
const WRITE_TX = { isolationLevel: "read committed" } as const;

/** Who makes the change, for the audit log. */
type Actor = { userId: number; ipAddress?: string | null };

type SampleRecordResult =
  | { ok: true; id: number; createdField: boolean; createdWell: boolean }
  | { ok: false; conflict: "label" };

/** The field of that name (created if new) and the well of that name in it (created if new). */
async function findOrCreatePlace(
  input: Pick<SampleRecordInput, "fieldName" | "fieldRegion" | "wellName">,
  db: Executor,
) {
  let createdField = false;
  let createdWell = false;
  let [field] = await db
    .select({ id: fields.id })
    .from(fields)
    .where(eq(fields.name, input.fieldName))
    .for("update");
  if (!field) {
    const [inserted] = await db
      .insert(fields)
      .values({ name: input.fieldName, region: input.fieldRegion ?? null })
      .$returningId();
    if (!inserted) throw new Error("field insert returned no id");
    field = inserted;
    createdField = true;
  }
  let [well] = await db
    .select({ id: wells.id })
    .from(wells)
    .where(and(eq(wells.fieldId, field.id), eq(wells.name, input.wellName)))
    .for("update");
  if (!well) {
    const [inserted] = await db
      .insert(wells)
      .values({ fieldId: field.id, name: input.wellName })
      .$returningId();
    if (!inserted) throw new Error("well insert returned no id");
    well = inserted;
    createdWell = true;
  }
  return { fieldId: field.id, wellId: well.id, createdField, createdWell };
}

function sampleColumns(input: SampleRecordInput) {
  return {
    label: input.label,
    sampleType: input.sampleType,
    samplingDate: input.samplingDate,
    samplingDepthFt: input.samplingDepthFt,
    reservoirPressurePsia: input.reservoirPressurePsia,
    reservoirTemperatureF: input.reservoirTemperatureF,
    stockTankApi: input.stockTankApi,
    gasSpecificGravity: input.gasSpecificGravity,
    standardPressurePsia: input.standardPressurePsia,
    standardTemperatureF: input.standardTemperatureF,
    barometricPressurePsia: input.barometricPressurePsia,
    laboratory: input.laboratory,
    reportReference: input.reportReference,
    notes: input.notes,
  };
}

async function labelTaken(
  wellId: number,
  label: string,
  exceptId: number | null,
  db: Executor,
) {
  const rows = await db
    .select({ id: samples.id })
    .from(samples)
    .where(and(eq(samples.wellId, wellId), eq(samples.label, label)));
  return rows.some((r) => r.id !== exceptId);
}

/** Creates the sample, with its field and well when they are new, and its audit record, in one transaction. */
export async function createSampleRecord(
  input: SampleRecordInput,
  actor: Actor,
  db: Executor = getDb(),
): Promise<SampleRecordResult> {
  return db
    .transaction(async (tx) => {
      const place = await findOrCreatePlace(input, tx);
      if (await labelTaken(place.wellId, input.label, null, tx)) tx.rollback();
      const [inserted] = await tx
        .insert(samples)
        .values({
          ...sampleColumns(input),
          wellId: place.wellId,
          createdBy: actor.userId,
        })
        .$returningId();
      if (!inserted) throw new Error("sample insert returned no id");
      await recordAudit(
        {
          action: "sample_created",
          userId: actor.userId,
          entityType: "sample",
          entityId: inserted.id,
          details: {
            label: input.label,
            well: input.wellName,
            field: input.fieldName,
            newField: place.createdField,
            newWell: place.createdWell,
          },
          ipAddress: actor.ipAddress ?? null,
        },
        tx,
      );
      return {
        ok: true as const,
        id: inserted.id,
        createdField: place.createdField,
        createdWell: place.createdWell,
      };
    }, WRITE_TX)
    .catch((error: unknown) => {
      if (isRollback(error))
        return { ok: false as const, conflict: "label" as const };
      throw error;
    });
}

/**
 * Updates the sample (moving it to another well, created if new) and records which fields changed, in one
 * transaction. Returns changed: [] when nothing differed (and records nothing).
 */
export async function updateSampleRecord(
  id: number,
  input: SampleRecordInput,
  actor: Actor,
  db: Executor = getDb(),
): Promise<SampleRecordResult & { changed?: string[] }> {
  return db
    .transaction(async (tx) => {
      const before = await getSampleRecord(id, tx);
      if (!before) throw new Error(`sample ${id} does not exist`);
      const place = await findOrCreatePlace(input, tx);
      if (await labelTaken(place.wellId, input.label, id, tx)) tx.rollback();
      const changed: string[] = (
        Object.keys(sampleColumns(input)) as (keyof ReturnType<
          typeof sampleColumns
        >)[]
      ).filter((k) => before[k] !== input[k]);
      changed.push(
        ...(before.wellName !== input.wellName ||
        before.fieldName !== input.fieldName
          ? ["well"]
          : []),
      );
      if (changed.length > 0) {
        await tx
          .update(samples)
          .set({ ...sampleColumns(input), wellId: place.wellId })
          .where(eq(samples.id, id));
        await recordAudit(
          {
            action: "sample_updated",
            userId: actor.userId,
            entityType: "sample",
            entityId: id,
            details: { changed },
            ipAddress: actor.ipAddress ?? null,
          },
          tx,
        );
      }
      return {
        ok: true as const,
        id,
        createdField: place.createdField,
        createdWell: place.createdWell,
        changed,
      };
    }, WRITE_TX)
    .catch((error: unknown) => {
      if (isRollback(error))
        return { ok: false as const, conflict: "label" as const };
      throw error;
    });
}

/** Our own rollback for a taken label, or the unique index catching two saves of the same label at once. */
function isRollback(error: unknown): boolean {
  if (error instanceof TransactionRollbackError) return true;
  const cause =
    error instanceof Error
      ? (error.cause as { code?: string; message?: string } | undefined)
      : undefined;
  return (
    cause?.code === "ER_DUP_ENTRY" &&
    /samples_well_id_label_unique/.test(cause.message ?? "")
  );
}

/** The editable record of a sample, with its field and well names, or null. */
export async function getSampleRecord(id: number, db: Executor = getDb()) {
  const [row] = await db
    .select({
      ...SAMPLE_COLUMNS,
      fieldName: fields.name,
      fieldRegion: fields.region,
      wellName: wells.name,
    })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .where(eq(samples.id, id));
  return row ?? null;
}

/** The list's sort keys (query string values): each names the column it sorts by (see searchSamples). */
type SampleSort =
  | "field"
  | "well"
  | "label"
  | "type"
  | "sampled"
  | "pressure"
  | "temperature"
  | "revision"
  | "updated";
/** approved: has an approved revision; none: has none; draft: has a draft awaiting review. */
type SampleStatusFilter = "approved" | "none" | "draft";

type SampleSearch = {
  q?: string;
  type?: SampleType;
  status?: SampleStatusFilter;
  sort: SampleSort;
  dir: "asc" | "desc";
  page: number;
  pageSize: number;
};

/** LIKE pattern for a free-text search, with the wildcards of the user's text escaped. */
function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** One page of samples matching the search, with the total count, latest approved revision and open drafts. */
export async function searchSamples(
  search: SampleSearch,
  db: Executor = getDb(),
) {
  const approved = db
    .select({
      sampleId: sampleRevisions.sampleId,
      number: sql<
        number | null
      >`max(case when ${sampleRevisions.status} = 'approved' then ${sampleRevisions.number} end)`.as(
        "approved_number",
      ),
      drafts:
        sql<number>`sum(case when ${sampleRevisions.status} = 'draft' then 1 else 0 end)`.as(
          "draft_count",
        ),
    })
    .from(sampleRevisions)
    .groupBy(sampleRevisions.sampleId)
    .as("revision_summary");

  const conditions: SQL[] = [];
  const q = search.q?.trim();
  if (q) {
    const pattern = containsPattern(q);
    conditions.push(
      or(
        like(samples.label, pattern),
        like(wells.name, pattern),
        like(fields.name, pattern),
        like(samples.laboratory, pattern),
        like(samples.reportReference, pattern),
      )!,
    );
  }
  if (search.type) conditions.push(eq(samples.sampleType, search.type));
  if (search.status === "approved")
    conditions.push(sql`${approved.number} is not null`);
  if (search.status === "none")
    conditions.push(sql`${approved.number} is null`);
  if (search.status === "draft")
    conditions.push(sql`coalesce(${approved.drafts}, 0) > 0`);
  const where = conditions.length > 0 ? and(...conditions) : undefined;

  const sortColumns: Record<SampleSort, SQLWrapper> = {
    field: fields.name,
    well: wells.name,
    label: samples.label,
    type: samples.sampleType,
    sampled: samples.samplingDate,
    pressure: samples.reservoirPressurePsia,
    temperature: samples.reservoirTemperatureF,
    revision: approved.number,
    updated: samples.updatedAt,
  };
  const key = sortColumns[search.sort];
  const direction = search.dir === "desc" ? desc : asc;
  // Empty values last in either direction, then a stable order by place and label.
  const order = [
    sql`${key} is null`,
    direction(key),
    asc(fields.name),
    asc(wells.name),
    asc(samples.label),
    asc(samples.id),
  ];

  const [total] = await db
    .select({ n: count() })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .leftJoin(approved, eq(approved.sampleId, samples.id))
    .where(where);
  const rows = await db
    .select({
      id: samples.id,
      label: samples.label,
      sampleType: samples.sampleType,
      samplingDate: samples.samplingDate,
      fieldName: fields.name,
      wellName: wells.name,
      laboratory: samples.laboratory,
      reservoirPressurePsia: samples.reservoirPressurePsia,
      reservoirTemperatureF: samples.reservoirTemperatureF,
      approvedRevision: approved.number,
      drafts: approved.drafts,
      updatedAt: samples.updatedAt,
    })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .leftJoin(approved, eq(approved.sampleId, samples.id))
    .where(where)
    .orderBy(...order)
    .limit(search.pageSize)
    .offset((search.page - 1) * search.pageSize);
  return {
    total: total?.n ?? 0,
    rows: rows.map((r) => ({
      ...r,
      approvedRevision:
        r.approvedRevision === null ? null : Number(r.approvedRevision),
      drafts: Number(r.drafts ?? 0),
    })),
  };
}

/** One sample with its own columns, its place and its latest approved revision (id and number), or null. */
export async function getSampleWithPlace(id: number, db: Executor = getDb()) {
  const [row] = await db
    .select({
      ...SAMPLE_COLUMNS,
      wellId: wells.id,
      wellName: wells.name,
      fieldId: fields.id,
      fieldName: fields.name,
      updatedAt: samples.updatedAt,
      approvedRevisionId: latestApprovedRevision("id"),
      approvedRevisionNumber: latestApprovedRevision("number"),
    })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .where(eq(samples.id, id));
  return row ?? null;
}

/** Every sample with its place and latest approved revision (id and number), for listings and the API. */
export async function listSamplesWithApproved(db: Executor = getDb()) {
  const approved = db
    .select({
      sampleId: sampleRevisions.sampleId,
      number: sql<number>`max(${sampleRevisions.number})`.as("approved_number"),
    })
    .from(sampleRevisions)
    .where(eq(sampleRevisions.status, "approved"))
    .groupBy(sampleRevisions.sampleId)
    .as("approved");
  return db
    .select({
      id: samples.id,
      label: samples.label,
      sampleType: samples.sampleType,
      fieldId: fields.id,
      fieldName: fields.name,
      wellName: wells.name,
      reservoirPressurePsia: samples.reservoirPressurePsia,
      reservoirTemperatureF: samples.reservoirTemperatureF,
      approvedRevision: approved.number,
      approvedRevisionId: latestApprovedRevision("id"),
    })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .leftJoin(approved, eq(approved.sampleId, samples.id))
    .orderBy(asc(fields.name), asc(wells.name), asc(samples.label));
}

/**
 * Locks the sample row for the rest of the transaction; false when there is no such sample. Every write to a
 * sample's revisions takes this lock first, so uploads and reviews of one sample run one after the other.
 */
export async function lockSample(
  sampleId: number,
  db: Executor,
): Promise<boolean> {
  const [row] = await db
    .select({ id: samples.id })
    .from(samples)
    .where(eq(samples.id, sampleId))
    .for("update");
  return !!row;
}
