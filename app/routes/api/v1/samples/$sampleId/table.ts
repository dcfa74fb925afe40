import { requireApiCaller } from "~/.server/api/caller";
import { respondWithEtag } from "~/.server/api/respond";
import { requireRevisionData, requireSampleForCaller } from "~/.server/api/samples";
import { SampleIdParams, TableQuery, zodIssues } from "~/.server/api/schemas";
import { fromInputPressure, fromInputTemperature } from "~/.server/api/units";
import { problem } from "~/.server/http";
import { runHeavy } from "~/.server/workers/pool";
import { formatTableCsv, formatTableJson, formatTableText, isTableError, parsePressureSpec } from "~/core/tables";
import type { Route } from "./+types/table";

const STATUS: Record<string, [number, string]> = {
  MALFORMED_PRESSURES: [400, "invalid_pressures"],
  INVALID_NUMBER: [400, "invalid_pressures"],
  NOT_FINITE: [400, "invalid_pressures"],
  NOT_POSITIVE: [400, "invalid_pressures"],
  NOT_INCREASING: [400, "invalid_pressures"],
  INVALID_STEP: [400, "invalid_pressures"],
  INVALID_RANGE: [400, "invalid_pressures"],
  TOO_MANY_ROWS: [400, "invalid_pressures"],
  INVALID_OPTIONS: [400, "invalid_query"],
  NO_GRIDS: [404, "property_not_measured"],
  NO_BUBBLE_POINT: [422, "out_of_range"],
  OUT_OF_RANGE: [422, "out_of_range"],
  NO_VALID_ZONE: [422, "out_of_range"],
  NONPHYSICAL_COLUMN: [422, "out_of_range"],
  INVALID_GRID: [500, "internal_error"],
};

/**
 * GET /api/v1/samples/:sampleId/table?temperature=212&pressures=500:5000:250&units=field&format=json|csv|text
 * A black-oil style table at one temperature, resampled on the requested pressures, in the order simulators need.
 */
export async function loader(args: Route.LoaderArgs) {
  const caller = await requireApiCaller(args, "tables:read");
  const params = SampleIdParams.safeParse(args.params);
  if (!params.success) return problem(400, "invalid_path", "The sample id must be a positive whole number.", { issues: zodIssues(params.error) });
  const query = TableQuery.safeParse(Object.fromEntries(new URL(args.request.url).searchParams));
  if (!query.success) return problem(400, "invalid_query", "The query string is not valid; see issues.", { issues: zodIssues(query.error) });
  const q = query.data;
  const sample = await requireSampleForCaller(caller, params.data.sampleId);
  const data = await requireRevisionData(sample, q.revision);
  try {
    const spec = parsePressureSpec(q.pressures);
    const table = await runHeavy("table", {
      grids: data.grids,
      temperature: fromInputTemperature(q.temperature, q.units),
      pressures: spec.pressures.map((p) => fromInputPressure(p, q.units)),
      method: q.method,
      extrapolate: q.extrapolate,
      messageUnits: q.units,
    });
    const options = { units: q.units, sampleLabel: `${sample.label} (${sample.wellName}, ${sample.fieldName}; sample id ${sample.id})`, revision: data.number, generatedAt: new Date() };
    if (q.format === "csv") {
      return respondWithEtag(args.request, formatTableCsv(table, options), { contentType: "text/csv; charset=utf-8", revision: data.number, headers: { "Content-Disposition": `inline; filename="isopleth-sample-${sample.id}-rev-${data.number}.csv"` } });
    }
    if (q.format === "text") {
      return respondWithEtag(args.request, formatTableText(table, options), { contentType: "text/plain; charset=utf-8", revision: data.number });
    }
    return respondWithEtag(args.request, JSON.stringify({ sampleId: sample.id, ...formatTableJson(table, options) }), { contentType: "application/json; charset=utf-8", revision: data.number });
  } catch (error) {
    if (isTableError(error)) {
      const [status, code] = STATUS[error.code] ?? [400, "invalid_query"];
      return problem(status, code, error.message);
    }
    throw error;
  }
}
