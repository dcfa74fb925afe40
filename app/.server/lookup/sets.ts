import { z } from "zod";
import { computeLookup, type LookupRequest } from "~/.server/api/lookup";
import {
  createLookupRun,
  createLookupSet,
  getLookupSet,
  listLookupRuns,
  type LookupRunResults,
} from "~/.server/db/queries/lookup-sets";
import { getSampleWithPlace } from "~/.server/db/queries/samples";
import {
  getRevisionData,
  resolveRevision,
} from "~/.server/samples/revision-data";
import { isLookupError } from "~/core/lookup";
import {
  fromInputPressureOn,
  fromInputTemperature,
  OUTPUT_SYSTEMS,
  PRESSURE_BASES,
  PROPERTIES,
  PROPERTY_KEYS,
} from "~/core/units";
import { labelSchema } from "~/utils/labels";

/*
 * Saved lookup sets: a person's list of conditions and properties for one sample, run again whenever the sample
 * gets a new approved revision. A run is the API's lookup (computeLookup) at the set's conditions, in field
 * units with extrapolation allowed, recorded with the revision and method it used.
 */

/** "Save as set" on the lookup page: the form's sample, properties, method and conditions in its unit system. */
export const SaveLookupSetSchema = z.object({
  intent: z.literal("save-set"),
  name: labelSchema(
    "set name",
    120,
    true,
    "Name the set, e.g. “CS-1 depletion path”.",
  ),
  sampleId: z.coerce.number().int().positive(),
  properties: z.array(z.enum(PROPERTY_KEYS)).min(1),
  units: z.enum(OUTPUT_SYSTEMS),
  /** Gauge conditions are made absolute with the sample's barometric pressure before they are saved. */
  pressureBasis: z.enum(PRESSURE_BASES).default("absolute"),
  method: z.enum(["auto", "newton", "pchip", "linear"]),
  degree: z
    .tuple([z.number().int().min(1).max(6), z.number().int().min(1).max(6)])
    .nullable(),
  conditions: z
    .array(
      z.object({
        pressure: z.number().finite(),
        temperature: z.number().finite(),
      }),
    )
    .min(1)
    .max(10_000),
});
type SaveLookupSetInput = z.infer<typeof SaveLookupSetSchema>;

/** Saves the set with its conditions in canonical units (psia, °F); returns what the page says about it. */
export async function saveLookupSet(
  userId: number,
  input: SaveLookupSetInput,
): Promise<string> {
  const sample =
    input.pressureBasis === "gauge"
      ? await getSampleWithPlace(input.sampleId)
      : null;
  const basis = {
    pressureBasis: input.pressureBasis,
    ...(sample
      ? { barometricPressurePsia: sample.barometricPressurePsia }
      : {}),
  };
  await createLookupSet({
    userId,
    sampleId: input.sampleId,
    name: input.name,
    properties: input.properties,
    method: input.method,
    degree: input.degree,
    conditions: input.conditions.map((c) => ({
      pressurePsia: fromInputPressureOn(c.pressure, input.units, basis),
      temperatureF: fromInputTemperature(c.temperature, input.units),
    })),
  });
  return `Saved “${input.name}” (${input.conditions.length} conditions).`;
}

/** The set page: the set (only among the user's own), its sample, its last runs and the revision a run would use. */
export async function getLookupSetPage(setId: number, userId: number) {
  const set = await getLookupSet(setId, userId);
  if (!set) return null;
  const [sample, runs, current] = await Promise.all([
    getSampleWithPlace(set.sampleId),
    listLookupRuns(set.id),
    resolveRevision(set.sampleId),
  ]);
  return {
    set,
    sampleLabel: sample?.label ?? "",
    runs,
    currentRevision: current?.number ?? null,
  };
}

type SetRunOutcome = { error: string | null };

/**
 * Runs the set against the sample's current approved revision and records the run (values in field units).
 * Null when the user has no such set; a property the revision did not measure is left out of the run.
 */
export async function runLookupSet(
  setId: number,
  userId: number,
): Promise<SetRunOutcome | null> {
  const set = await getLookupSet(setId, userId);
  if (!set) return null;
  const revision = await resolveRevision(set.sampleId);
  if (!revision)
    return { error: "The sample has no approved revision to run against." };
  const [data, sample] = await Promise.all([
    getRevisionData(revision),
    getSampleWithPlace(set.sampleId),
  ]);
  if (!sample) return { error: "The sample no longer exists." };
  const pressures = Float64Array.from(set.conditions, (c) => c.pressurePsia);
  const temperatures = Float64Array.from(set.conditions, (c) => c.temperatureF);
  const results: LookupRunResults = {};
  for (const property of set.properties) {
    try {
      const run = await computeLookup(
        data,
        {
          property,
          pressures,
          temperatures,
          method: set.method as LookupRequest["method"],
          degree: set.degree ?? undefined,
          extrapolate: true,
          units: "field",
          sample,
        },
        { surface: "page" },
      );
      if (!run) continue;
      results[property] = readResults(run.value.resultsUtf8);
    } catch (error) {
      if (isLookupError(error))
        return { error: `${PROPERTIES[property].phrase}: ${error.message}` };
      throw error;
    }
  }
  await createLookupRun({
    setId: set.id,
    revisionId: data.revisionId,
    revisionNumber: data.number,
    method: set.method,
    results,
    createdBy: userId,
  });
  return { error: null };
}

/** What a run keeps of each point of the API's results: value, error estimate and warning codes. */
function readResults(utf8: Uint8Array): LookupRunResults[string] {
  const points = JSON.parse(new TextDecoder().decode(utf8)) as {
    value: number | null;
    errorEstimate: number | null;
    warnings: string[];
  }[];
  return points.map((p) => ({
    value: p.value,
    errorEstimate: p.errorEstimate,
    warnings: p.warnings,
  }));
}
