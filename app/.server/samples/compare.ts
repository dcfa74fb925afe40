import { z } from "zod";
import { gridsForOutput, listSamplesForCaller } from "~/.server/api/samples";
import type { SessionUser } from "~/.server/auth/session";
import { getSampleWithPlace } from "~/.server/db/queries/samples";
import { reportBaseOf } from "~/.server/samples/present";
import {
  getRevisionData,
  resolveRevision,
} from "~/.server/samples/revision-data";
import {
  OUTPUT_SYSTEMS,
  PROPERTY_KEYS,
  unitLabel,
  type OutputSystem,
} from "~/core/units";
import { MAX_COMPARED_SAMPLES, SURFACE_ARRANGEMENTS } from "~/utils/compare";
import type { CompareSelection, CompareView } from "~/components/compare/types";

/**
 * The query string: ?samples=1,2 (or samples=1&samples=2)&property=oil_fvf&units=field&view=side-by-side. Bad values
 * fall back to defaults rather than failing the page.
 */
const CompareQuery = z.object({
  samples: z
    .array(z.string())
    .transform((list) =>
      [
        ...new Set(
          list.flatMap((v) => v.split(",")).map((v) => Number(v.trim())),
        ),
      ]
        .filter((n) => Number.isInteger(n) && n > 0)
        .slice(0, MAX_COMPARED_SAMPLES),
    ),
  property: z.enum(PROPERTY_KEYS).catch("oil_fvf"),
  units: z.enum(OUTPUT_SYSTEMS).optional().catch(undefined),
  view: z.enum(SURFACE_ARRANGEMENTS).catch("overlaid"),
});
type CompareQuery = z.infer<typeof CompareQuery>;

/** The compare page's query from its URL's search parameters (never fails: bad values take the defaults). */
export function parseCompareQuery(params: URLSearchParams): CompareQuery {
  return CompareQuery.parse({
    samples: params.getAll("samples"),
    property: params.get("property") ?? undefined,
    units: params.get("units") ?? undefined,
    view: params.get("view") ?? undefined,
  });
}

/**
 * What the compare page shows for `user` and `query`: the samples the user may choose, and for each chosen
 * one its approved revision and grid of the property, in the query's unit system (the user's by default).
 */
export async function buildCompareView(
  user: SessionUser,
  query: CompareQuery,
): Promise<CompareView> {
  const system: OutputSystem = query.units ?? user.unitSystem;
  const samples = await listSamplesForCaller({ user, token: null }, system);
  const chosen = query.samples
    .map((id) => samples.find((s) => s.id === id))
    .filter((s) => s !== undefined);
  const selected = await Promise.all(
    chosen.map(async (s): Promise<CompareSelection> => {
      const revision =
        s.approvedRevision === null ? null : await resolveRevision(s.id);
      if (!revision)
        return { id: s.id, label: s.label, revision: null, grid: null };
      const [data, record] = await Promise.all([
        getRevisionData(revision),
        getSampleWithPlace(s.id),
      ]);
      if (!record)
        return { id: s.id, label: s.label, revision: null, grid: null };
      const grid =
        gridsForOutput(data, system, reportBaseOf(record)).find(
          (g) => g.property === query.property,
        ) ?? null;
      return { id: s.id, label: s.label, revision: data.number, grid };
    }),
  );
  const valueUnit = unitLabel(system, query.property);
  return {
    units: {
      system,
      pressure: unitLabel(system, "pressure"),
      temperature: unitLabel(system, "temperature"),
      // a dimensionless property (z) has no unit to show: "z", not "z (–)"
      value: /^[-–—]?$/.test(valueUnit) ? "" : valueUnit,
    },
    property: query.property,
    view: query.view,
    samples: samples.map((s) => ({
      id: s.id,
      label: s.label,
      field: s.field,
      well: s.well,
      approvedRevision: s.approvedRevision,
      properties: s.properties,
      reservoirPressure: s.reservoirPressure,
      reservoirTemperature: s.reservoirTemperature,
    })),
    selected,
  };
}
