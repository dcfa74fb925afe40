import { requireApiCaller } from "~/.server/api/caller";
import { parseApiQuery } from "~/.server/api/request";
import { json } from "~/.server/api/respond";
import { listSamplesForCaller, unitsBlock } from "~/.server/api/samples";
import { SampleListQuery } from "~/.server/api/schemas";
import type { Route } from "./+types/index";

/** GET /api/v1/samples — the samples the caller may read. */
export async function loader(args: Route.LoaderArgs) {
  const caller = await requireApiCaller(args, "list-samples");
  const { units } = parseApiQuery(args.request, SampleListQuery);
  const samples = await listSamplesForCaller(caller, units);
  return json(args.request, { units: unitsBlock(units), samples });
}
