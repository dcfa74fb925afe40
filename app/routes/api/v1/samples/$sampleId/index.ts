import { requireApiCaller } from "~/.server/api/caller";
import { parseApiPath, parseApiQuery } from "~/.server/api/request";
import { json } from "~/.server/api/respond";
import {
  gridsForOutput,
  isApprovedStatus,
  requireRevisionData,
  requireSampleForCaller,
} from "~/.server/api/samples";
import { SampleIdParams, SampleQuery } from "~/.server/api/schemas";
import { toOutputPressure, toOutputTemperature, unitLabel } from "~/core/units";
import type { Route } from "./+types/index";

/** GET /api/v1/samples/:sampleId — metadata and the grids of the current approved revision (or ?revision=N). */
export async function loader(args: Route.LoaderArgs) {
  const caller = await requireApiCaller(args, "read-sample");
  const { sampleId } = parseApiPath(args.params, SampleIdParams);
  const query = parseApiQuery(args.request, SampleQuery);
  const sample = await requireSampleForCaller(caller, sampleId);
  const data = await requireRevisionData(caller, sample, query.revision);
  const system = query.units;
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
        reservoirPressure:
          sample.reservoirPressurePsia === null
            ? null
            : toOutputPressure(sample.reservoirPressurePsia, system),
        reservoirTemperature:
          sample.reservoirTemperatureF === null
            ? null
            : toOutputTemperature(sample.reservoirTemperatureF, system),
        stockTankApi: sample.stockTankApi,
        gasSpecificGravity: sample.gasSpecificGravity,
        standardConditions: {
          pressurePsia: sample.standardPressurePsia,
          temperatureF: sample.standardTemperatureF,
        },
        laboratory: sample.laboratory,
        reportReference: sample.reportReference,
      },
      revision: {
        number: data.number,
        status: data.status,
        approved: isApprovedStatus(data.status),
      },
      units: {
        system,
        pressure: unitLabel(system, "pressure"),
        temperature: unitLabel(system, "temperature"),
      },
      bubblePoints: data.bubblePoints.map((b) => ({
        temperature: toOutputTemperature(b.temperatureF, system),
        pressure: toOutputPressure(b.bubblePointPsia, system),
      })),
      grids: gridsForOutput(data, system),
    },
    data,
  );
}
