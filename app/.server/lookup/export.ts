import { z } from "zod";
import type { ApiCaller } from "~/.server/api/caller";
import { computeLookup, type LookupRequest } from "~/.server/api/lookup";
import {
  draftWarning,
  requireRevisionData,
  requireSampleForCaller,
} from "~/.server/api/samples";
import type { LookupRunPoint } from "~/.server/db/schema";
import type { Grid } from "~/core/interpolation";
import { describeLookupMethod, isLookupError } from "~/core/lookup";
import {
  lookupSheet,
  measuredDigits,
  TABLE_CAUTION,
  type LookupSheetInput,
  type Sheet,
} from "~/core/tables";
import {
  fromCanonical,
  isUnitId,
  OUTPUT_SYSTEMS,
  outputUnitSystem,
  PROPERTIES,
  PROPERTY_KEYS,
  PROPERTY_QUANTITIES,
  standardConditionsLabel,
  unitLabel,
  type PropertyKey,
} from "~/core/units";
import { reportBaseOf } from "~/.server/samples/present";

/*
 * The lookup page's export: the form's lookup, computed again on the server by the one lookup computation
 * (computeLookup) and written as a sheet (app/core/tables/sheet.ts) — headers in words with units, values
 * rounded to the digits the revision's measured grids carry, estimates to two digits, flags and refusals per
 * value, and the caution in the file.
 */

/** What the lookup page sends to export: its sample, revision, properties, settings and conditions. */
export const LookupExportSchema = z.object({
  sampleId: z.number().int().positive(),
  revision: z.number().int().positive().optional(),
  properties: z
    .array(z.enum(PROPERTY_KEYS))
    .min(1, "Choose at least one property to export."),
  units: z.enum(OUTPUT_SYSTEMS),
  method: z.enum(["auto", "newton", "pchip", "linear"]),
  degree: z
    .tuple([z.number().int().min(1).max(6), z.number().int().min(1).max(6)])
    .nullable()
    .optional(),
  extrapolate: z.boolean().default(false),
  conditions: z
    .array(
      z.object({
        pressure: z.number().finite(),
        temperature: z.number().finite(),
      }),
    )
    .min(1, "There are no conditions to export.")
    .max(10_000, "At most 10,000 conditions can be exported at once."),
});
type LookupExportInput = z.infer<typeof LookupExportSchema>;

/** The API's per-point results (its JSON) as a run keeps and an export writes them. */
export function readLookupPoints(utf8: Uint8Array): LookupRunPoint[] {
  const points = JSON.parse(new TextDecoder().decode(utf8)) as {
    value: number | null;
    errorEstimate: number | null;
    warnings: string[];
    method?: string | null;
    refused?: { code: string; message: string };
    /** The earlier name of a refusal in the API's results. */
    refusal?: { code: string; message: string };
  }[];
  return points.map((p) => {
    const refused = p.refused ?? p.refusal ?? null;
    return {
      value: refused ? null : p.value,
      errorEstimate: refused ? null : p.errorEstimate,
      warnings: p.warnings ?? [],
      method: p.method ?? null,
      ...(refused
        ? { refused: { code: refused.code, message: refused.message } }
        : {}),
    };
  });
}

/** The significant digits a grid's measured values carry in the laboratory's unit (null: not known). */
export function gridDigits(
  grid: (Grid & { sourceUnit?: string | null }) | undefined,
  property: PropertyKey,
): number | null {
  if (!grid) return null;
  const quantity = PROPERTY_QUANTITIES[property];
  const unit = grid.sourceUnit;
  return measuredDigits(
    grid.values,
    unit && isUnitId(quantity, unit)
      ? (v) => fromCanonical(v, quantity, unit)
      : undefined,
  );
}

/** The lookup as a sheet, with a file name; access and revision rules are the API's (a thrown problem). */
export async function lookupExportSheet(
  caller: ApiCaller,
  input: LookupExportInput,
): Promise<{ sheet: Sheet; fileBase: string }> {
  const sample = await requireSampleForCaller(caller, input.sampleId);
  const data = await requireRevisionData(caller, sample, input.revision);
  const pressures = Float64Array.from(input.conditions, (c) => c.pressure);
  const temperatures = Float64Array.from(
    input.conditions,
    (c) => c.temperature,
  );
  const notes: string[] = [];
  const properties: LookupSheetInput["properties"][number][] = [];
  let description: string | null = null;
  for (const property of input.properties) {
    try {
      const run = await computeLookup(
        data,
        {
          property,
          pressures,
          temperatures,
          method: input.method as LookupRequest["method"],
          degree: input.degree ?? undefined,
          extrapolate: input.extrapolate,
          units: input.units,
          sample,
        },
        { surface: "page" },
      );
      if (!run) {
        notes.push(
          `${PROPERTIES[property].name}: not measured in revision ${data.number}.`,
        );
        continue;
      }
      description = run.value.methodDescription;
      properties.push({
        property,
        unit: run.value.units.value,
        points: readLookupPoints(run.value.resultsUtf8),
        digits: gridDigits(data.grids[property], property),
      });
    } catch (error) {
      if (!isLookupError(error)) throw error;
      notes.push(
        `${PROPERTIES[property].name}: not computed — ${error.message}`,
      );
    }
  }
  // No property answered: the method as asked, in words.
  description ??= describeLookupMethod(input.method, input.degree ?? undefined);
  const draft = draftWarning(data, sample.id);
  const base = outputUnitSystem(input.units).standardConditions.label;
  const reportBase = standardConditionsLabel(reportBaseOf(sample));
  const sheet = lookupSheet({
    about: [
      ...(draft ? [draft] : []),
      `Isopleth lookup — sample ${sample.label} (${sample.wellName}, ${sample.fieldName}), revision ${data.number}`,
      `Settings: ${description} · extrapolation ${input.extrapolate ? "on" : "off"} · ${input.units} units`,
      `Generated ${new Date().toISOString()}`,
      `Gas volumes (Rs, Bg) at ${base}${reportBase === base ? "" : ` (rebased from the report's ${reportBase})`}; absolute pressures`,
      "Values rounded to the significant digits the measured data carry; error estimates to two significant digits.",
      ...notes,
      `Caution: ${TABLE_CAUTION}`,
    ],
    pressureUnit: unitLabel(input.units, "pressure"),
    temperatureUnit: unitLabel(input.units, "temperature"),
    conditions: input.conditions,
    properties,
  });
  return {
    sheet,
    fileBase: `isopleth-lookup-${sample.label}-rev-${data.number}`,
  };
}
