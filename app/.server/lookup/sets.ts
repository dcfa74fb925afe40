import { z } from "zod";
import { computeLookup, type LookupRequest } from "~/.server/api/lookup";
import {
  createLookupRun,
  createLookupSet,
  getLookupRun,
  getLookupSet,
  listLookupRuns,
  type LookupRunResults,
  type LookupRunRow,
} from "~/.server/db/queries/lookup-sets";
import { getSampleWithPlace } from "~/.server/db/queries/samples";
import {
  getRevisionData,
  resolveRevision,
  type RevisionData,
} from "~/.server/samples/revision-data";
import type {
  SetRunCompareView,
  SetRunSummary,
  SetRunView,
  SetSettingsView,
} from "~/components/lookup/set-runs";
import { formatDecimals } from "~/core/format";
import { describeLookupMethod, isLookupError } from "~/core/lookup";
import {
  lookupSheet,
  roundCondition,
  roundEstimate,
  TABLE_CAUTION,
  type Sheet,
} from "~/core/tables";
import {
  fromInputPressureOn,
  fromInputTemperature,
  isPropertyKey,
  OUTPUT_SYSTEMS,
  PRESSURE_BASES,
  PROPERTIES,
  PROPERTY_KEYS,
  toOutputPressure,
  toOutputTemperature,
  unitLabel,
  type OutputSystem,
  type PropertyKey,
} from "~/core/units";
import { labelSchema } from "~/utils/labels";
import { gridDigits, readLookupPoints } from "./export";

/*
 * Saved lookup sets: a person's list of conditions and properties for one sample, run again whenever the sample
 * gets a new approved revision. A run is the one lookup computation (computeLookup, the API's) at the set's
 * conditions with the set's own settings — method, degree, extrapolation and unit system — and records them
 * with the revision, the values, error estimates, warnings, methods and refusals it gave.
 */

/** "Save as set" on the lookup page: the form's sample, properties, settings and conditions in its unit system. */
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
  /** Absent from older pages: off, as the lookup page starts. */
  extrapolate: z.boolean().default(false),
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
    units: input.units,
    extrapolate: input.extrapolate,
    conditions: input.conditions.map((c) => ({
      pressurePsia: fromInputPressureOn(c.pressure, input.units, basis),
      temperatureF: fromInputTemperature(c.temperature, input.units),
    })),
  });
  return `Saved “${input.name}” (${input.conditions.length} conditions).`;
}

type SetRow = NonNullable<Awaited<ReturnType<typeof getLookupSet>>>;
type Settings = {
  method: string;
  degree: number | [number, number] | null;
  extrapolate: boolean;
  units: OutputSystem;
};

const degreePair = (
  d: number | [number, number] | null,
): [number, number] | undefined =>
  d === null ? undefined : Array.isArray(d) ? d : [d, d];

/** "auto (Newton, degree 3 × 3, pchip where it overshoots) · extrapolation off · field units". */
function settingsText(s: Settings): string {
  let method: string;
  try {
    method = describeLookupMethod(
      s.method as LookupRequest["method"],
      degreePair(s.degree),
    );
  } catch {
    method = s.method;
  }
  return `${method} · extrapolation ${s.extrapolate ? "on" : "off"} · ${s.units} units`;
}

function settingsView(s: Settings): SetSettingsView {
  return {
    method: s.method,
    degree: degreePair(s.degree) ?? null,
    extrapolate: s.extrapolate,
    units: s.units,
    text: settingsText(s),
  };
}

/** The set's conditions in a unit system (10 significant digits: the round-off of the conversion dropped). */
function conditionsIn(set: SetRow, units: OutputSystem) {
  return set.conditions.map((c) => ({
    pressure: roundCondition(toOutputPressure(c.pressurePsia, units)),
    temperature: roundCondition(toOutputTemperature(c.temperatureF, units)),
  }));
}

function propertiesOf(run: LookupRunRow): PropertyKey[] {
  return Object.keys(run.results).filter(isPropertyKey);
}

function unitOf(run: LookupRunRow, property: PropertyKey): string {
  return run.valueUnits?.[property] ?? unitLabel(run.units, property);
}

const isoTime = (d: Date | string) =>
  new Date(d).toISOString().replace("T", " ").slice(0, 19) + " UTC";

function summaryOf(run: LookupRunRow): SetRunSummary {
  const points = Object.values(run.results).flat();
  return {
    id: run.id,
    createdAt: isoTime(run.createdAt),
    revisionNumber: run.revisionNumber,
    settings: settingsView(run),
    refused: points.filter((p) => p.refused || p.value === null).length,
    flagged: points.filter((p) => p.warnings.length > 0).length,
  };
}

/** A run as the set page shows it: per condition and property the value, estimate, method, flags or refusal. */
function runView(set: SetRow, run: LookupRunRow): SetRunView {
  const properties = propertiesOf(run);
  const conditions = conditionsIn(set, run.units);
  return {
    ...summaryOf(run),
    pressureUnit: unitLabel(run.units, "pressure"),
    temperatureUnit: unitLabel(run.units, "temperature"),
    properties: properties.map((p) => ({
      property: p,
      name: PROPERTIES[p].name,
      unit: unitOf(run, p),
    })),
    rows: conditions.map((c, i) => ({
      ...c,
      cells: properties.map((p) => {
        const x = run.results[p]?.[i];
        return {
          property: p,
          value: x?.refused ? null : (x?.value ?? null),
          errorEstimate: x?.refused
            ? null
            : roundEstimate(x?.errorEstimate ?? null),
          method: x?.method ?? null,
          warnings: x?.warnings ?? [],
          refused: x?.refused
            ? x.refused.message
            : x && x.value === null
              ? "The lookup gave no value for this point."
              : x
                ? null
                : "Not in this run.",
        };
      }),
    })),
  };
}

/**
 * Two runs side by side, per condition and property: the value of each, the change b − a and its share of a
 * (in %), and whether the change exceeds the two error estimates together. Runs in different unit systems
 * are compared by the relative change only (the values stay in their own units).
 */
function compareView(
  set: SetRow,
  a: LookupRunRow,
  b: LookupRunRow,
): SetRunCompareView {
  const properties = [...new Set([...propertiesOf(a), ...propertiesOf(b)])];
  const sameUnits = a.units === b.units;
  const conditions = conditionsIn(set, b.units);
  let changed = 0;
  const rows = conditions.map((c, i) => ({
    ...c,
    cells: properties.map((p) => {
      const x = a.results[p]?.[i];
      const y = b.results[p]?.[i];
      const va = x && !x.refused ? x.value : null;
      const vb = y && !y.refused ? y.value : null;
      const both = va !== null && vb !== null;
      const difference = both && sameUnits ? vb - va : null;
      const relative =
        both && va !== 0 ? ((vb - va) / Math.abs(va)) * 100 : null;
      const ea = x?.errorEstimate ?? null;
      const eb = y?.errorEstimate ?? null;
      const beyond =
        difference !== null && ea !== null && eb !== null
          ? Math.abs(difference) > ea + eb
          : null;
      if (both ? va !== vb : (va === null) !== (vb === null)) changed++;
      return {
        property: p,
        a: va,
        b: vb,
        difference,
        relativePercent:
          relative === null ? null : Number(formatDecimals(relative, 3)),
        beyondEstimates: beyond,
        aNote: x?.refused?.message ?? (x ? null : "not in this run"),
        bNote: y?.refused?.message ?? (y ? null : "not in this run"),
      };
    }),
  }));
  return {
    a: summaryOf(a),
    b: summaryOf(b),
    sameUnits,
    pressureUnit: unitLabel(b.units, "pressure"),
    temperatureUnit: unitLabel(b.units, "temperature"),
    properties: properties.map((p) => ({
      property: p,
      name: PROPERTIES[p].name,
      unitA: unitOf(a, p),
      unitB: unitOf(b, p),
    })),
    rows,
    changedCount: changed,
  };
}

/** Which runs the page shows: `?run=<id>` (default the latest) and `?compare=<id>,<id>` (default the last two). */
type SetPageChoice = { run?: number; compare?: [number, number] };

/** Reads the page's query string; anything unreadable is ignored (the defaults apply). */
export function setPageChoice(url: URL): SetPageChoice {
  const id = (s: string | null | undefined) =>
    s && /^[1-9]\d{0,15}$/.test(s) ? Number(s) : undefined;
  const run = id(url.searchParams.get("run"));
  const a = id(url.searchParams.get("a"));
  const b = id(url.searchParams.get("b"));
  return {
    ...(run ? { run } : {}),
    ...(a && b ? { compare: [a, b] as [number, number] } : {}),
  };
}

/** The set page: the set (only among the user's own), its sample, its runs, the chosen run and a comparison. */
export async function getLookupSetPage(
  setId: number,
  userId: number,
  choice: SetPageChoice = {},
) {
  const set = await getLookupSet(setId, userId);
  if (!set) return null;
  const [sample, runs, current] = await Promise.all([
    getSampleWithPlace(set.sampleId),
    listLookupRuns(set.id),
    resolveRevision(set.sampleId),
  ]);
  const find = async (id: number) =>
    runs.find((r) => r.id === id) ?? (await getLookupRun(set.id, id));
  const shown = choice.run ? await find(choice.run) : (runs[0] ?? null);
  let pair: [LookupRunRow, LookupRunRow] | null = null;
  if (choice.compare) {
    const [a, b] = await Promise.all(choice.compare.map(find));
    if (a && b) pair = [a, b];
  } else if (runs[0] && runs[1]) pair = [runs[1], runs[0]];
  return {
    set: {
      id: set.id,
      name: set.name,
      sampleId: set.sampleId,
      conditionCount: set.conditions.length,
      properties: set.properties.map((p) => PROPERTIES[p].phrase),
      settings: settingsView(set),
    },
    sampleLabel: sample?.label ?? "",
    runs: runs.map(summaryOf),
    run: shown ? runView(set, shown) : null,
    compare: pair ? compareView(set, pair[0], pair[1]) : null,
    currentRevision: current?.number ?? null,
  };
}

type SetRunOutcome = { error: string | null; runId?: number };

/**
 * Runs the set against the sample's current approved revision with the set's method, degree, extrapolation
 * and unit system, and records the run. Null when the user has no such set; a property the revision did not
 * measure is left out of the run. A point the lookup cannot serve is recorded refused, with its reason.
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
  const units = set.units;
  const pressures = Float64Array.from(set.conditions, (c) =>
    toOutputPressure(c.pressurePsia, units),
  );
  const temperatures = Float64Array.from(set.conditions, (c) =>
    toOutputTemperature(c.temperatureF, units),
  );
  const results: LookupRunResults = {};
  const valueUnits: Record<string, string> = {};
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
          extrapolate: set.extrapolate,
          units,
          sample,
        },
        { surface: "page" },
      );
      if (!run) continue;
      results[property] = readLookupPoints(run.value.resultsUtf8);
      valueUnits[property] = run.value.units.value;
    } catch (error) {
      if (isLookupError(error))
        return { error: `${PROPERTIES[property].phrase}: ${error.message}` };
      throw error;
    }
  }
  const runId = await createLookupRun({
    setId: set.id,
    revisionId: data.revisionId,
    revisionNumber: data.number,
    method: set.method,
    degree: set.degree,
    extrapolate: set.extrapolate,
    units,
    valueUnits,
    results,
    createdBy: userId,
  });
  return { error: null, runId };
}

/** A recorded run as a sheet (CSV or XLSX), rounded as lookups are: the revision's measured digits. */
export async function lookupRunSheet(
  setId: number,
  runId: number,
  userId: number,
): Promise<{ sheet: Sheet; fileBase: string } | null> {
  const set = await getLookupSet(setId, userId);
  if (!set) return null;
  const run = await getLookupRun(set.id, runId);
  if (!run) return null;
  const sample = await getSampleWithPlace(set.sampleId);
  let data: RevisionData | null = null;
  if (run.revisionId !== null)
    data = await getRevisionData({
      id: run.revisionId,
      number: run.revisionNumber,
      status: "approved",
    }).catch(() => null);
  const properties = propertiesOf(run);
  const sheet = lookupSheet({
    name: "Lookup set run",
    about: [
      `Isopleth lookup set “${set.name}” — sample ${sample?.label ?? set.sampleId}, revision ${run.revisionNumber}, run ${isoTime(run.createdAt)}`,
      `Settings: ${settingsText(run)}`,
      `Values rounded to the significant digits the measured data carry; error estimates to two significant digits.`,
      `Caution: ${TABLE_CAUTION}`,
    ],
    pressureUnit: unitLabel(run.units, "pressure"),
    temperatureUnit: unitLabel(run.units, "temperature"),
    conditions: conditionsIn(set, run.units),
    properties: properties.map((p) => ({
      property: p,
      unit: unitOf(run, p),
      points: run.results[p] ?? [],
      digits: gridDigits(data?.grids[p], p),
    })),
  });
  return {
    sheet,
    fileBase: `isopleth-set-${set.id}-run-${run.id}-rev-${run.revisionNumber}`,
  };
}
