import { requireApiCaller } from "~/.server/api/caller";
import { json } from "~/.server/api/respond";
import { gridsForOutput, requireRevisionData, requireSampleForCaller } from "~/.server/api/samples";
import { SampleIdParams, SampleQuery, zodIssues } from "~/.server/api/schemas";
import { toOutputPressure, toOutputTemperature, unitLabel } from "~/.server/api/units";
import { problem } from "~/.server/http";
import type { Route } from "./+types/index";

/** GET /api/v1/samples/:sampleId — metadata and the grids of the current approved revision (or ?revision=N). */
export async function loader(args: Route.LoaderArgs) {
  const caller = await requireApiCaller(args, "read");
  const params = SampleIdParams.safeParse(args.params);
  if (!params.success) return problem(400, "invalid_path", "The sample id must be a positive whole number.", { issues: zodIssues(params.error) });
  const query = SampleQuery.safeParse(Object.fromEntries(new URL(args.request.url).searchParams));
  if (!query.success) return problem(400, "invalid_query", "The query string is not valid.", { issues: zodIssues(query.error) });
  const sample = await requireSampleForCaller(caller, params.data.sampleId);
  const data = await requireRevisionData(sample, query.data.revision);
  const system = query.data.units;
  return json(
    args.request,
    {
      sample: {
        id: sample.id,
        label: sample.label,
        field: sample.fieldName,
        well: sample.wellName,
        sampleType: sample.sampleType,
        samplingDate: sample.samplingDate,
        samplingDepthFt: sample.samplingDepthFt,
        reservoirPressure: sample.reservoirPressurePsia === null ? null : toOutputPressure(sample.reservoirPressurePsia, system),
        reservoirTemperature: sample.reservoirTemperatureF === null ? null : toOutputTemperature(sample.reservoirTemperatureF, system),
        stockTankApi: sample.stockTankApi,
        gasSpecificGravity: sample.gasSpecificGravity,
        standardConditions: { pressurePsia: sample.standardPressurePsia, temperatureF: sample.standardTemperatureF },
        laboratory: sample.laboratory,
        reportReference: sample.reportReference,
      },
      revision: { number: data.number, status: data.status },
      units: { system, pressure: unitLabel(system, "pressure"), temperature: unitLabel(system, "temperature") },
      bubblePoints: data.bubblePoints.map((b) => ({ temperature: toOutputTemperature(b.temperatureF, system), pressure: toOutputPressure(b.bubblePointPsia, system) })),
      grids: gridsForOutput(data, system),
    },
    data.number,
  );
}
