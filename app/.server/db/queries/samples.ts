import { asc, count, eq, sql } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { fields, sampleRevisions, samples, wells } from "../schema";

export async function countCatalogue(db: Executor = getDb()) {
  const [f] = await db.select({ n: count() }).from(fields);
  const [w] = await db.select({ n: count() }).from(wells);
  const [s] = await db.select({ n: count() }).from(samples);
  return { fields: f?.n ?? 0, wells: w?.n ?? 0, samples: s?.n ?? 0 };
}

export async function getSampleWithPlace(id: number, db: Executor = getDb()) {
  const [row] = await db
    .select({
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
      laboratory: samples.laboratory,
      reportReference: samples.reportReference,
      notes: samples.notes,
      wellId: wells.id,
      wellName: wells.name,
      fieldId: fields.id,
      fieldName: fields.name,
      updatedAt: samples.updatedAt,
      approvedRevisionId: sql<
        number | null
      >`(SELECT r.id FROM sample_revisions r WHERE r.sample_id = ${samples.id} AND r.status = 'approved' ORDER BY r.number DESC LIMIT 1)`,
      approvedRevisionNumber: sql<
        number | null
      >`(SELECT r.number FROM sample_revisions r WHERE r.sample_id = ${samples.id} AND r.status = 'approved' ORDER BY r.number DESC LIMIT 1)`,
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
      approvedRevisionId: sql<
        number | null
      >`(SELECT r.id FROM sample_revisions r WHERE r.sample_id = ${samples.id} AND r.status = 'approved' ORDER BY r.number DESC LIMIT 1)`,
    })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .leftJoin(approved, eq(approved.sampleId, samples.id))
    .orderBy(asc(fields.name), asc(wells.name), asc(samples.label));
}
