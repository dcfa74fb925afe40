import { requireApiCaller } from "~/.server/api/caller";
import { parseApiPath, parseApiQuery } from "~/.server/api/request";
import { json } from "~/.server/api/respond";
import {
  requireRevisionData,
  requireSampleForCaller,
  sampleDetailForOutput,
} from "~/.server/api/samples";
import { SampleIdParams, SampleQuery } from "~/.server/api/schemas";
import type { Route } from "./+types/index";

/** GET /api/v1/samples/:sampleId — metadata and the grids of the current approved revision (or ?revision=N). */
export async function loader(args: Route.LoaderArgs) {
  const caller = await requireApiCaller(args, "read-sample");
  const { sampleId } = parseApiPath(args.params, SampleIdParams);
  const query = parseApiQuery(args.request, SampleQuery);
  const sample = await requireSampleForCaller(caller, sampleId);
  const data = await requireRevisionData(caller, sample, query.revision);
  return json(
    args.request,
    sampleDetailForOutput(sample, data, query.units),
    data,
  );
}
