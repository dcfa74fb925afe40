import { asc, count, eq } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { fields, samples, wells } from "../schema";

/* Fields and wells: the places samples come from, for pickers and counts. */

export async function countCatalogue(db: Executor = getDb()) {
  const [f] = await db.select({ n: count() }).from(fields);
  const [w] = await db.select({ n: count() }).from(wells);
  const [s] = await db.select({ n: count() }).from(samples);
  return { fields: f?.n ?? 0, wells: w?.n ?? 0, samples: s?.n ?? 0 };
}

/** Fields and samples for pickers (token restrictions, lookups, comparisons). */
export async function listFieldsAndSamples(db: Executor = getDb()) {
  const fieldRows = await db
    .select({ id: fields.id, name: fields.name })
    .from(fields)
    .orderBy(asc(fields.name));
  const sampleRows = await db
    .select({
      id: samples.id,
      label: samples.label,
      fieldId: wells.fieldId,
      wellName: wells.name,
    })
    .from(samples)
    .innerJoin(wells, eq(wells.id, samples.wellId))
    .orderBy(asc(samples.label));
  return { fields: fieldRows, samples: sampleRows };
}

/** Names of fields and wells for the pickers of the sample form. */
export async function listFieldsAndWells(db: Executor = getDb()) {
  const fieldRows = await db
    .select({ id: fields.id, name: fields.name, region: fields.region })
    .from(fields)
    .orderBy(asc(fields.name));
  const wellRows = await db
    .select({
      id: wells.id,
      name: wells.name,
      fieldId: wells.fieldId,
      fieldName: fields.name,
    })
    .from(wells)
    .innerJoin(fields, eq(fields.id, wells.fieldId))
    .orderBy(asc(fields.name), asc(wells.name));
  return { fields: fieldRows, wells: wellRows };
}
