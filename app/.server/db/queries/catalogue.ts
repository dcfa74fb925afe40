import { asc, eq } from "drizzle-orm";
import { getDb, type Executor } from "../client";
import { fields, samples, wells } from "../schema";

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
