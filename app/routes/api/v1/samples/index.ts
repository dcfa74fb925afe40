import { requireApiCaller } from "~/.server/api/caller";
import { json } from "~/.server/api/respond";
import { listSamplesForCaller } from "~/.server/api/samples";
import { UnitsParam, zodIssues } from "~/.server/api/schemas";
import { unitLabel } from "~/.server/api/units";
import { problem } from "~/.server/http";
import type { Route } from "./+types/index";

/** GET /api/v1/samples — the samples the caller may read. */
export async function loader(args: Route.LoaderArgs) {
  const caller = await requireApiCaller(args, "read");
  const units = UnitsParam.safeParse(new URL(args.request.url).searchParams.get("units") ?? undefined);
  if (!units.success) return problem(400, "invalid_query", "units must be field or metric.", { issues: zodIssues(units.error) });
  const samples = await listSamplesForCaller(caller, units.data);
  return json(args.request, {
    units: { system: units.data, pressure: unitLabel(units.data, "pressure"), temperature: unitLabel(units.data, "temperature") },
    samples,
  });
}
