import { requireApiCaller } from "~/.server/api/caller";
import { parseApiPath, parseApiQuery } from "~/.server/api/request";
import {
  requireRevisionData,
  requireSampleForCaller,
} from "~/.server/api/samples";
import { SampleIdParams, TableQuery } from "~/.server/api/schemas";
import { tableResponse } from "~/.server/api/table";
import type { Route } from "./+types/table";

/**
 * GET /api/v1/samples/:sampleId/table?temperature=212&pressures=500:5000:250&units=field&format=json|csv|text
 * A black-oil style table at one temperature, resampled on the requested pressures, in the order simulators need.
 */
export async function loader(args: Route.LoaderArgs) {
  const caller = await requireApiCaller(args, "export-table");
  const { sampleId } = parseApiPath(args.params, SampleIdParams);
  const query = parseApiQuery(args.request, TableQuery);
  const sample = await requireSampleForCaller(caller, sampleId);
  const data = await requireRevisionData(caller, sample, query.revision);
  return tableResponse(args.request, sample, data, query);
}
