import { and, desc, eq } from "drizzle-orm";
import type { OutputSystem, PropertyKey } from "~/core/units";
import { getDb, type Executor } from "../client";
import { lookupRuns, lookupSets, samples } from "../schema";

/* A person's saved lookup sets and the recorded runs of each. */

export async function listLookupSets(userId: number, db: Executor = getDb()) {
  return db
    .select({
      id: lookupSets.id,
      name: lookupSets.name,
      sampleId: lookupSets.sampleId,
      sampleLabel: samples.label,
      properties: lookupSets.properties,
      conditions: lookupSets.conditions,
      method: lookupSets.method,
      degree: lookupSets.degree,
      units: lookupSets.units,
      extrapolate: lookupSets.extrapolate,
      updatedAt: lookupSets.updatedAt,
    })
    .from(lookupSets)
    .innerJoin(samples, eq(samples.id, lookupSets.sampleId))
    .where(eq(lookupSets.userId, userId))
    .orderBy(desc(lookupSets.updatedAt));
}

export async function getLookupSet(
  id: number,
  userId: number,
  db: Executor = getDb(),
) {
  const [row] = await db
    .select()
    .from(lookupSets)
    .where(and(eq(lookupSets.id, id), eq(lookupSets.userId, userId)));
  return row ?? null;
}

export async function createLookupSet(
  input: {
    userId: number;
    sampleId: number;
    name: string;
    properties: PropertyKey[];
    conditions: { pressurePsia: number; temperatureF: number }[];
    method: string;
    degree: number | [number, number] | null;
    units: OutputSystem;
    extrapolate: boolean;
  },
  db: Executor = getDb(),
): Promise<number> {
  const [row] = await db.insert(lookupSets).values(input).$returningId();
  if (!row) throw new Error("lookup set insert returned no id");
  return row.id;
}

export async function deleteLookupSet(
  id: number,
  userId: number,
  db: Executor = getDb(),
) {
  await db
    .delete(lookupSets)
    .where(and(eq(lookupSets.id, id), eq(lookupSets.userId, userId)));
}

/** A run's values per property and condition (in the run's unit system). */
export type LookupRunResults = (typeof lookupRuns.$inferSelect)["results"];

export async function createLookupRun(
  input: {
    setId: number;
    revisionId: number;
    revisionNumber: number;
    method: string;
    degree: number | [number, number] | null;
    extrapolate: boolean;
    units: OutputSystem;
    valueUnits: Record<string, string>;
    results: LookupRunResults;
    createdBy: number;
  },
  db: Executor = getDb(),
): Promise<number> {
  const [row] = await db.insert(lookupRuns).values(input).$returningId();
  if (!row) throw new Error("lookup run insert returned no id");
  return row.id;
}

const RUN_COLUMNS = {
  id: lookupRuns.id,
  setId: lookupRuns.setId,
  revisionId: lookupRuns.revisionId,
  revisionNumber: lookupRuns.revisionNumber,
  method: lookupRuns.method,
  degree: lookupRuns.degree,
  extrapolate: lookupRuns.extrapolate,
  units: lookupRuns.units,
  valueUnits: lookupRuns.valueUnits,
  results: lookupRuns.results,
  createdAt: lookupRuns.createdAt,
};

/** The set's last runs, newest first. */
export async function listLookupRuns(
  setId: number,
  limit = 20,
  db: Executor = getDb(),
) {
  return db
    .select(RUN_COLUMNS)
    .from(lookupRuns)
    .where(eq(lookupRuns.setId, setId))
    .orderBy(desc(lookupRuns.createdAt), desc(lookupRuns.id))
    .limit(limit);
}

export type LookupRunRow = Awaited<ReturnType<typeof listLookupRuns>>[number];

/** One run of the set, or null. */
export async function getLookupRun(
  setId: number,
  runId: number,
  db: Executor = getDb(),
): Promise<LookupRunRow | null> {
  const [row] = await db
    .select(RUN_COLUMNS)
    .from(lookupRuns)
    .where(and(eq(lookupRuns.setId, setId), eq(lookupRuns.id, runId)));
  return row ?? null;
}
