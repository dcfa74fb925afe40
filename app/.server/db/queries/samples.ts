import { asc, count, eq, sql } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { fields, sampleRevisions, samples, wells } from "../schema";

export type SampleListItem = {
  id: number;
  label: string;
  sampleType: string;
  samplingDate: string | null;
  fieldName: string;
  wellName: string;
  reservoirTemperatureF: number | null;
  reservoirPressurePsia: number | null;
  approvedRevision: number | null;
};

export async function listSamples(db: Executor = getDb()): Promise<SampleListItem[]> {
  const approved = db
    .select({
      sampleId: sampleRevisions.sampleId,
      number: sql<number>`max(${sampleRevisions.number})`.as("number"),
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
      samplingDate: samples.samplingDate,
      fieldName: fields.name,
      wellName: wells.name,
      reservoirTemperatureF: samples.reservoirTemperatureF,
      reservoirPressurePsia: samples.reservoirPressurePsia,
      approvedRevision: approved.number,
    })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .leftJoin(approved, eq(approved.sampleId, samples.id))
    .orderBy(asc(fields.name), asc(wells.name), asc(samples.label));
}

export async function countCatalogue(db: Executor = getDb()) {
  const [f] = await db.select({ n: count() }).from(fields);
  const [w] = await db.select({ n: count() }).from(wells);
  const [s] = await db.select({ n: count() }).from(samples);
  return { fields: f?.n ?? 0, wells: w?.n ?? 0, samples: s?.n ?? 0 };
}
